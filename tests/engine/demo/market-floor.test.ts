import { describe, expect, it } from 'vitest';
import { generateMarket, generateMarketWithOracle, SHIFT_MARKET, type MarketSpec } from '../../../src/engine';

// The bench's floor (generateMarketWithOracle) and the level-shift market. Invented data, so
// these check the generator's own promises, not reference values.
const SMALL: MarketSpec = { ...SHIFT_MARKET, start: '2026-06-01', end: '2026-10-31' };

describe('generateMarketWithOracle(spec, seed)', () => {
  const { rows, oracle } = generateMarketWithOracle(SMALL, 2);

  it('gives the same rows as generateMarket and one floor value per row', () => {
    expect(rows).toEqual(generateMarket(SMALL, 2));
    expect(oracle).toHaveLength(rows.length);
    expect(oracle.every(Number.isFinite)).toBe(true);
  });

  it('lies far closer to the prices than naive-week does, yet not on them (noise remains)', () => {
    const perDay = 48;
    let floor = 0, week = 0, n = 0;
    for (let i = 7 * perDay; i < rows.length; i++) {
      floor += Math.abs(rows[i].price - oracle[i]);
      week += Math.abs(rows[i].price - rows[i - 7 * perDay].price);
      n++;
    }
    expect(floor / n).toBeLessThan(0.6 * (week / n));
    expect(floor / n).toBeGreaterThan(1);
  });
});

describe('SHIFT_MARKET', () => {
  it('doubles its price level around the fuel shock of 18 August 2026 (four-week ramp)', () => {
    const rows = generateMarket(SMALL, 1);
    const mean = (from: string, to: string) => {
      const p = rows.filter((r) => r.timestamp.slice(0, 10) >= from && r.timestamp.slice(0, 10) <= to).map((r) => r.price);
      return p.reduce((a, b) => a + b, 0) / p.length;
    };
    const ratio = mean('2026-09-20', '2026-10-31') / mean('2026-06-01', '2026-08-10');
    expect(ratio).toBeGreaterThan(1.6);
    expect(ratio).toBeLessThan(2.6);
  });
});
