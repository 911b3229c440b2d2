import { describe, expect, it } from 'vitest';
import { fromScaled, levelScale, toScaled } from '../../../src/engine/features/level-scale';
import ref from '../../reference/fixtures/r-quantile-mad.json';

const rows = (...days: number[][]) => days.map((d) => Float64Array.from(d));
// the 14 prices of the fixture as two days of 7 slots
const twoDays = rows(ref.mad.prices.slice(0, 7), ref.mad.prices.slice(7));

describe('levelScale(price, d, window)', () => {
  it('is the median and the MAD × 1.4826 of the window before d, like R median() and mad()', () => {
    // reference: r-quantile-mad.json — R 4.2.2 median(prices) = 38, mad(prices) = 6.15279 (mad's default constant 1.4826)
    const s = levelScale(twoDays, 2, 2)!;
    expect(s.centre).toBeCloseTo(ref.mad.median, 12);
    expect(s.scale).toBeCloseTo(ref.mad.mad, 12);
  });

  it('matches R on an odd count with negatives', () => {
    // reference: R median(x) = 29.9, mad(x) = 37.95456 (r-quantile-mad.json madOdd)
    const s = levelScale(rows(ref.madOdd.x), 1, 1)!;
    expect(s.centre).toBeCloseTo(ref.madOdd.median, 12);
    expect(s.scale).toBeCloseTo(ref.madOdd.mad, 10);
  });

  it('reads only the window days d-window .. d-1 and skips unknown prices', () => {
    const withMore = [Float64Array.of(1e6, -1e6), ...twoDays.map((r) => Float64Array.from(r)), Float64Array.of(1e6, 1e6)];
    withMore[1][3] = NaN; withMore[2][0] = NaN; // prices[3] and prices[7] unknown
    const s = levelScale(withMore, 3, 2)!;
    // reference: R 4.2.2, k <- prices[-c(4, 8)]; median(k) = 38.85, mad(k) = 6.59757 (run when writing this test)
    expect(s.centre).toBeCloseTo(38.85, 12);
    expect(s.scale).toBeCloseTo(6.59757, 10);
  });

  it('is undefined with no known price in the window', () => {
    expect(levelScale(rows([NaN, NaN], [1, 2]), 1, 1)).toBeUndefined();
    expect(levelScale(rows([1, 2]), 0, 28)).toBeUndefined();
  });

  it('keeps a floor for a flat window', () => {
    expect(levelScale(rows([50, 50, 50]), 1, 1)).toEqual({ centre: 50, scale: 0.05 });
    expect(levelScale(rows([0, 0, 0]), 1, 1)).toEqual({ centre: 0, scale: 1e-3 });
  });
});

describe('toScaled(p, scale) and fromScaled(z, scale)', () => {
  const scale = { centre: ref.mad.median, scale: ref.mad.mad };

  it('toScaled is asinh((p − centre) / scale), like R asinh()', () => {
    // reference: R asinh((prices - median(prices)) / mad(prices)) (r-quantile-mad.json)
    ref.mad.prices.forEach((p, i) => expect(toScaled(p, scale)).toBeCloseTo(ref.asinh.values[i], 12));
  });

  it('fromScaled undoes toScaled, also far out in the tails and for negative prices', () => {
    for (const p of [-500, -12.75, 0, 38, 41.6, 120, 3000]) expect(fromScaled(toScaled(p, scale), scale)).toBeCloseTo(p, 9);
  });

  it('keeps NaN unknown', () => {
    expect(toScaled(NaN, scale)).toBeNaN();
    expect(fromScaled(NaN, scale)).toBeNaN();
  });
});
