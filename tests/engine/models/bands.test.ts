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
  it('puts the edges at the conformal order statistics of the errors of the slot and its neighbours within an hour', () => {
    // the 11 values of r-quantile-mad.json sorted: -12.75 -3.5 0 12.25 17 29.9 40 41.2 55.5 63.3 88.1, each 9 times in slot 0
    // (99 errors, the fewest the widest reported level, 98 %, needs); 99 sevens in slot 12
    const pool = emptyPool(24, 200);
    pool.bySlot[0] = Array.from({ length: 99 }, (_, i) => ref.quantile.x[i % 11]);
    pool.bySlot[12] = new Array(99).fill(7);
    const point = new Float64Array(24).fill(100);
    const half = band(pool, point, 2, 0.5);
    // 50 % of 99: ranks floor(100 · 0.25) = 25 and ceil(100 · 0.75) = 75, i.e. the 3rd and 9th distinct values (hand-worked)
    for (const s of [23, 0, 1]) {
      expect(half.lower[s]).toBe(100 + 2 * 0);
      expect(half.upper[s]).toBe(100 + 2 * 55.5);
    }
    for (const s of [11, 12, 13]) expect([half.lower[s], half.upper[s]]).toEqual([114, 114]);
    // slot 6 has no error within an hour: its reach grows to ±6 hours and takes in both slots' 198 errors;
    // ranks floor(199 · 0.25) = 49 (a seven) and ceil(199 · 0.75) = 150 (29.9, after 27 values below 7, 99 sevens and 18 more)
    expect(half.lower[6]).toBe(114);
    expect(half.upper[6]).toBeCloseTo(100 + 2 * 29.9, 12);
    const wide = band(pool, point, 2, 0.98);
    // 98 % of 99: ranks 1 and 99, the extremes
    expect([wide.lower[0], wide.upper[0]]).toEqual([100 - 2 * 12.75, 100 + 2 * 88.1]);
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
    const pool = emptyPool(96, 200);
    pool.bySlot[0] = new Array(99).fill(1);
    pool.bySlot[9] = new Array(99).fill(2);
    const { lower } = band(pool, new Float64Array(96), 1, 0.5);
    expect(lower[4]).toBe(1); // slots 0..8
    expect(lower[92]).toBe(1); // slots 88..95 and 0
    expect(lower[5]).toBe(2); // slots 1..9
  });

  it('gives no band while the whole day holds too few errors, and the whole day\'s once a slot\'s neighbourhood holds too few', () => {
    const pool = emptyPool(24, 200);
    pool.bySlot[0] = new Array(10).fill(1);
    pool.bySlot[12] = new Array(10).fill(3);
    const half = band(pool, new Float64Array(24), 1, 0.5);
    // 20 errors of the whole day at 50 %: ranks floor(21 · 0.25) = 5 and ceil(21 · 0.75) = 16
    for (let s = 0; s < 24; s++) expect([half.lower[s], half.upper[s]]).toEqual([1, 3]);
    // 90 % needs 19, 98 % needs 99: with 20, the 98 % band is unknown
    expect(band(pool, new Float64Array(24), 1, 0.98).lower[0]).toBeNaN();
    expect(band(pool, new Float64Array(24), 1, 0.9).lower[0]).toBe(1);
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
