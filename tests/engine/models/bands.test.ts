import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { gaussianSource } from '../../../src/engine/demo/gaussian';
import { addResiduals, band, bands, conformalRanks, emptyPool, quantile } from '../../../src/engine/models/bands';
import ref from '../../reference/fixtures/r-quantile-mad.json';

const sorted = (xs: number[]) => [...xs].sort((a, b) => a - b);

describe('quantile(sorted, q) is Hyndman & Fan (1996) type 7', () => {
  // reference: r-quantile-mad.json — R 4.2.2 quantile(x, probs, type = 7) (script in README-engine-fixtures.md)
  it.each([
    ['eleven distinct values with negatives', ref.quantile],
    ['eight values with ties', ref.quantileTies],
  ])('matches R quantile(type = 7) on %s', (_what, r) => {
    const xs = sorted(r.x);
    r.probs.forEach((q, i) => expect(quantile(xs, q)).toBeCloseTo(r.values[i], 10));
  });

  it('gives the only value for a single value', () => {
    expect(quantile([4.5], 0)).toBe(4.5);
    expect(quantile([4.5], 0.37)).toBe(4.5);
    expect(quantile([4.5], 1)).toBe(4.5);
  });
});

describe('addResiduals(pool, actual, forecast, scale)', () => {
  it('keeps (actual − forecast) / scale per slot, skips unknowns and keeps only the newest `keep`', () => {
    const pool = emptyPool(2, 3);
    addResiduals(pool, [10, NaN], [8, 1], 2);
    addResiduals(pool, [4, 5], [6, 1], 2);
    addResiduals(pool, [0, 5], [0, NaN], 2);
    addResiduals(pool, [3, 5], [0, 5], 2);
    expect(pool.bySlot[0]).toEqual([-1, 0, 1.5]);
    expect(pool.bySlot[1]).toEqual([2, 0]);
  });
});

describe('conformalRanks(n, coverage)', () => {
  // split-conformal ranks k = floor((n + 1)(1 - c)/2), k' = ceil((n + 1)(1 + c)/2) (Lei et al. 2018, JASA 113(523)), worked by hand
  it.each([
    [99, 0.9, 5, 95],
    [19, 0.9, 1, 19],
    [18, 0.9, 0, 19],
    [11, 0.5, 3, 9],
    [273, 0.98, 2, 272],
  ])('with %d errors at coverage %d takes ranks %d and %d', (n, c, lo, hi) => {
    expect(conformalRanks(n, c)).toEqual({ lo, hi });
  });
});

describe('band(pool, point, scale, coverage)', () => {
  it('puts the edges at the conformal order statistics of the pooled errors of the slot and its neighbours', () => {
    // the 11 values of r-quantile-mad.json sorted: -12.75 -3.5 0 12.25 17 29.9 40 41.2 55.5 63.3 88.1;
    // at 50 %: ranks 3 and 9 -> 0 and 55.5; at 90 % ranks 0 and 12 of 11, so no band
    const pool = emptyPool(24, 100);
    pool.bySlot[0] = [...ref.quantile.x]; // unsorted, as a pool holds them
    const point = new Float64Array(24).fill(100);
    const half = band(pool, point, 2, 0.5);
    for (const s of [23, 0, 1]) {
      expect(half.lower[s]).toBe(100 + 2 * 0);
      expect(half.upper[s]).toBe(100 + 2 * 55.5);
    }
    // slot 2 reaches slots 1..3 only: no errors there
    expect(half.lower[2]).toBeNaN();
    expect(half.upper[22]).toBeNaN();
    const wide = band(pool, point, 2, 0.9);
    expect(wide.lower[0]).toBeNaN();
    expect(wide.upper[0]).toBeNaN(); // rank 12 of 11
  });

  it('gives NaN at 90 % while a slot and its neighbours hold fewer than 19 errors', () => {
    const pool = emptyPool(24, 100);
    const add = () => addResiduals(pool, [1, ...new Array(23).fill(NaN)], new Array(24).fill(0), 1);
    for (let k = 0; k < 18; k++) add();
    expect(band(pool, new Float64Array(24), 1, 0.9).lower[0]).toBeNaN();
    add();
    expect(band(pool, new Float64Array(24), 1, 0.9).lower[0]).toBe(1);
  });

  it('reaches one hour either side for quarter-hour slots (±4 slots)', () => {
    const pool = emptyPool(96, 100);
    for (let k = 0; k < 3; k++) addResiduals(pool, [1, ...new Array(95).fill(NaN)], new Array(96).fill(0), 1);
    const { lower } = band(pool, new Float64Array(96), 1, 0.5);
    expect(lower[4]).toBe(1);
    expect(lower[92]).toBe(1);
    expect(lower[5]).toBeNaN();
    expect(lower[91]).toBeNaN();
  });

  it('bands(pool, point, scale, coverages) gives each coverage the band band() gives it', () => {
    const pool = emptyPool(24, 200);
    const normal = gaussianSource(seedrandom('levels'));
    for (let d = 0; d < 60; d++) addResiduals(pool, Array.from({ length: 24 }, normal), new Array(24).fill(0), 1);
    const point = new Float64Array(24).fill(30);
    const all = bands(pool, point, 2, [0.5, 0.9, 0.98]);
    all.forEach((b) => expect({ lower: b.lower, upper: b.upper }).toEqual(band(pool, point, 2, b.coverage)));
    for (let s = 0; s < 24; s++) expect(all[0].upper[s] - all[0].lower[s]).toBeLessThan(all[2].upper[s] - all[2].lower[s]);
  });

  it('covers about the nominal share of new i.i.d. errors', () => {
    // common practice: empirical quantiles of exchangeable errors cover about the nominal share (split conformal, Vovk et al. 2005)
    const normal = gaussianSource(seedrandom('bands'));
    const slots = 24, zero = new Array(slots).fill(0);
    for (const coverage of [0.5, 0.8, 0.9, 0.98]) {
      const pool = emptyPool(slots, 400);
      for (let d = 0; d < 400; d++) addResiduals(pool, Array.from({ length: slots }, normal), zero, 1);
      const { lower, upper } = band(pool, new Float64Array(slots), 1, coverage);
      let inside = 0, total = 0;
      for (let d = 0; d < 400; d++) for (let s = 0; s < slots; s++) {
        const e = normal();
        total++;
        if (e >= lower[s] && e <= upper[s]) inside++;
      }
      expect(Math.abs(inside / total - coverage)).toBeLessThan(0.02);
    }
  });

  it('scales with the day scale', () => {
    const pool = emptyPool(24, 100);
    for (let k = 0; k < 20; k++) addResiduals(pool, new Array(24).fill(k - 10), new Array(24).fill(0), 1);
    const point = new Float64Array(24).fill(50);
    const one = band(pool, point, 1, 0.9), three = band(pool, point, 3, 0.9);
    expect(three.upper[5] - 50).toBeCloseTo(3 * (one.upper[5] - 50), 12);
    expect(three.lower[5] - 50).toBeCloseTo(3 * (one.lower[5] - 50), 12);
  });
});
