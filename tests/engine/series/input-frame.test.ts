import { describe, expect, it } from 'vitest';
import { inputFrame, type Series } from '../../../src/engine';

/** Hourly Berlin series over local days from 2025-01-06, values per period (NaN = empty). */
function series(days: number, price: (k: number) => number, load: (k: number) => number): Series {
  const t0 = Date.parse('2025-01-05T23:00:00Z');
  const times = Array.from({ length: days * 24 }, (_, k) => t0 + k * 3_600_000);
  return { times, price: times.map((_, k) => price(k)), drivers: { load: times.map((_, k) => load(k)) }, resolution: 60, zone: 'Europe/Berlin' };
}

describe('inputFrame(series)', () => {
  it('ends the price rows with the last day that has a known price and keeps the driver rows of later days', () => {
    const f = inputFrame(series(5, (k) => (k < 3 * 24 ? k : NaN), (k) => 100 + k));
    expect(f.price).toHaveLength(3);
    expect(f.drivers.load).toHaveLength(5);
    expect(f.days.map((d) => d.date)).toEqual(['2025-01-06', '2025-01-07', '2025-01-08', '2025-01-09', '2025-01-10']);
    expect(f.drivers.load[4][0]).toBe(100 + 96);
  });

  it('fills an unknown price or driver with the same slot of the nearest earlier day that has one', () => {
    const gaps = new Set([30, 54]); // 06:00 on day 1 and day 2
    const f = inputFrame(series(4, (k) => (gaps.has(k) ? NaN : k), (k) => (k === 75 ? NaN : k)));
    expect(f.price[1][6]).toBe(6);
    expect(f.price[2][6]).toBe(6);
    expect(f.drivers.load[3][3]).toBe(51);
  });

  it('fills the rest of a partly known last day from its own past', () => {
    const f = inputFrame(series(3, (k) => (k < 2 * 24 + 10 ? k : NaN), () => 1));
    expect(f.price).toHaveLength(3);
    expect(f.price[2][9]).toBe(57);
    expect(f.price[2][10]).toBe(34);
    expect(f.price[2][23]).toBe(47);
  });

  it('leaves values before the first known one unknown', () => {
    const f = inputFrame(series(2, (k) => (k < 5 ? NaN : k), () => 1));
    expect(f.price[0][4]).toBeNaN();
    expect(f.price[1][4]).toBe(28);
  });

  it('does not change the series it reads', () => {
    const s = series(2, (k) => (k === 30 ? NaN : k), () => 1);
    inputFrame(s);
    expect(s.price[30]).toBeNaN();
  });

  it('has no price rows when no price is known', () => {
    expect(inputFrame(series(2, () => NaN, () => 1)).price).toEqual([]);
  });
});
