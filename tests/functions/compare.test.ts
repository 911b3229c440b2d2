import { describe, expect, it } from 'vitest';
import { compareForecasts } from '../../src/engine';
import { compare } from '../../src/functions/compare';

const col = <T,>(a: T[]) => a.map((v) => [v]);
// the worked example of the engine's compareForecasts (src/engine/compare/compare-forecasts.ts): 3 days of 2 periods
const actual = col([10, 20, 10, 20, 10, 20]);
const a = col([11, 20, 10, 21, 12, 20]);
const b = col([13, 18, 14, 20, 10, 25]);

describe('compare', () => {
  it('compare(actual, A, B, "abs", 2) groups 2 rows per day and gives the engine\'s p-value', () => {
    const engine = compareForecasts([10, 20, 10, 20, 10, 20], [11, 20, 10, 21, 12, 20], [13, 18, 14, 20, 10, 25], [0, 0, 1, 1, 2, 2]);
    expect(compare(actual, a, b, 'abs', 2)).toBe(engine.pValue);
    expect(compare(actual, a, b, 'abs', 2)).toBeLessThan(0.05);
  });

  it('compare groups rows by the date of their timestamps when a range of them is given', () => {
    // serials 45658 + h/24 for two periods on each of three days
    const times = col([45658, 45658.5, 45659, 45659.5, 45660, 45660.5]);
    expect(compare(actual, a, b, null, times)).toBe(compare(actual, a, b, 'abs', 2));
    const iso = col(['2025-01-01T00:00+01:00', '2025-01-01T12:00+01:00', '2025-01-02T00:00+01:00', '2025-01-02T12:00+01:00', '2025-01-03T00:00+01:00', '2025-01-03T12:00+01:00']);
    expect(compare(actual, a, b, null, iso)).toBe(compare(actual, a, b, 'abs', 2));
  });

  it('compare defaults to 24 periods per day', () => {
    const n = 72;
    const x = col(Array.from({ length: n }, (_, i) => 40 + (i % 24)));
    const fa = col(Array.from({ length: n }, (_, i) => 40 + (i % 24) + (i % 3 === 0 ? 1 : 0)));
    const fb = col(Array.from({ length: n }, (_, i) => 40 + (i % 24) + (i % 2 === 0 ? 3 : -2) * (1 + Math.floor(i / 24))));
    expect(compare(x, fa, fb, null, null)).toBe(compare(x, fa, fb, 'abs', 24));
  });

  it('compare refuses an unknown loss, a bad day count and different sizes', () => {
    expect(() => compare(actual, a, b, 'hinge', 2)).toThrow(/loss "hinge" is not known/);
    expect(() => compare(actual, a, b, 'abs', 0)).toThrow(/periods per day must be a whole number/);
    expect(() => compare(actual, a.slice(1), b, 'abs', 2)).toThrow(/same size/);
    expect(() => compare(actual, a, b, 'abs', col([45658, 45659]))).toThrow(/timestamps range has 2 cells but actual has 6/);
  });
});
