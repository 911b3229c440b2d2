import { describe, expect, it } from 'vitest';
import { checkInputPrices, priceBounds, priceRangeOf, widenRange } from '../../../src/engine/models/price-range';
import type { DayFrame } from '../../../src/engine/series/day-frame';

const frame = (rows: number[][]): DayFrame => ({
  zone: 'Europe/Berlin', resolution: 60, slots: rows[0].length,
  days: rows.map((_, d) => ({ date: `2025-06-${String(d + 1).padStart(2, '0')}`, start: d * rows[0].length, count: rows[0].length, expected: rows[0].length })) as DayFrame['days'],
  price: rows.map((r) => Float64Array.from(r)), drivers: {},
});

describe('priceRangeOf(rows)', () => {
  it('is the lowest and highest known price, skipping unknowns', () => {
    expect(priceRangeOf([Float64Array.of(3, NaN, -2), Float64Array.of(9, 4, NaN)])).toEqual({ lo: -2, hi: 9 });
    expect(priceRangeOf([Float64Array.of(NaN)])).toBeUndefined();
  });
});

describe('priceBounds(range) and widenRange(a, b)', () => {
  it('reaches three widths of the training range beyond each end (hand-worked: -10 … 180 → -580 … 750)', () => {
    expect(priceBounds({ lo: -10, hi: 180 })).toEqual({ lo: -580, hi: 750 });
  });
  it('keeps room of 10 % of the level around a flat range (a capped price)', () => {
    expect(priceBounds({ lo: 50, hi: 50 })).toEqual({ lo: 35, hi: 65 });
  });
  it('widens with a later range and ignores an empty one', () => {
    expect(widenRange({ lo: 0, hi: 10 }, { lo: -5, hi: 8 })).toEqual({ lo: -5, hi: 10 });
    expect(widenRange({ lo: 0, hi: 10 }, undefined)).toEqual({ lo: 0, hi: 10 });
  });
});

describe('checkInputPrices(view, from, to, range, forDay)', () => {
  const rows = [[40, 45, 50], [42, 48000, 47], [41, 44, 49]];
  it('names the day and clock time of a price typed a thousand times too large', () => {
    expect(() => checkInputPrices(frame(rows), 0, 3, { lo: 20, hi: 90 }, '2025-06-04'))
      .toThrow('cannot forecast 2025-06-04: the price of 2025-06-02 01:00 is 48000, far outside the 20 to 90 the model was trained on');
  });
  it('passes a spike to three times the training high, negative prices and unknowns', () => {
    const spiky = [[40, 270, -30], [NaN, 44, 49]];
    expect(() => checkInputPrices(frame(spiky), 0, 2, { lo: 20, hi: 90 }, '2025-06-03')).not.toThrow();
  });
  it('looks only at the rows asked for', () => {
    expect(() => checkInputPrices(frame(rows), 2, 3, { lo: 20, hi: 90 }, '2025-06-04')).not.toThrow();
  });
});
