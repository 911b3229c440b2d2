import { describe, expect, it } from 'vitest';
import { band } from '../../src/functions/band';
import { engineForecast, fixture, oneTable } from './fixture';

describe('band', () => {
  it('band(stored, ranges) spills lower and upper columns equal to the engine band at 0.9', () => {
    const { market, stored } = fixture();
    const out = band(stored, oneTable(market), null);
    const engine = engineForecast(stored, market);
    expect(out).toHaveLength(25);
    expect(out.map((r) => r[0])).toEqual(engine.map((r) => r.lower));
    expect(out.map((r) => r[1])).toEqual(engine.map((r) => r.upper));
    expect(out.every(([lo, up]) => lo < up)).toBe(true);
  });

  it('band widens with coverage', () => {
    const { market, stored } = fixture();
    const width = (c: number) => band(stored, oneTable(market), c).reduce((s, [lo, up]) => s + up - lo, 0);
    expect(width(0.95)).toBeGreaterThan(width(0.6));
  });

  it('band refuses a coverage given in percent or outside (0.5, 1)', () => {
    const { market, stored } = fixture();
    expect(() => band(stored, oneTable(market), 90)).toThrow(/coverage must be a fraction between 0.5 and 1/);
    expect(() => band(stored, oneTable(market), 'wide')).toThrow(/not a number/);
  });
});
