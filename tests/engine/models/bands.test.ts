import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { gaussianSource } from '../../../src/engine/demo/gaussian';
import { addResiduals, band, emptyPool, quantile } from '../../../src/engine/models/bands';
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

describe('band(pool, point, scale, coverage)', () => {
  it('puts the bands at the type-7 quantiles of the pooled errors of the slot and its neighbours', () => {
    // reference: R quantile(x, c(0.05, 0.95), type = 7) = -8.125, 75.7 (r-quantile-mad.json)
    const pool = emptyPool(24, 100);
    pool.bySlot[0] = [...ref.quantile.x]; // unsorted, as a pool holds them
    const point = new Float64Array(24).fill(100);
    const { lower, upper } = band(pool, point, 2, 0.9);
    for (const s of [23, 0, 1]) {
      expect(lower[s]).toBeCloseTo(100 + 2 * -8.125, 10);
      expect(upper[s]).toBeCloseTo(100 + 2 * 75.7, 10);
    }
    // slot 2 reaches slots 1..3 only: no errors there
    expect(lower[2]).toBeNaN();
    expect(upper[22]).toBeNaN();
  });

  it('gives NaN while a slot and its neighbours hold fewer than 5 errors', () => {
    const pool = emptyPool(24, 100);
    const add = () => addResiduals(pool, [1, ...new Array(23).fill(NaN)], new Array(24).fill(0), 1);
    for (let k = 0; k < 4; k++) add();
    expect(band(pool, new Float64Array(24), 1, 0.9).lower[0]).toBeNaN();
    add();
    expect(band(pool, new Float64Array(24), 1, 0.9).lower[0]).toBe(1);
  });

  it('reaches one hour either side for quarter-hour slots (±4 slots)', () => {
    const pool = emptyPool(96, 100);
    for (let k = 0; k < 5; k++) addResiduals(pool, [1, ...new Array(95).fill(NaN)], new Array(96).fill(0), 1);
    const { lower } = band(pool, new Float64Array(96), 1, 0.9);
    expect(lower[4]).toBe(1);
    expect(lower[92]).toBe(1);
    expect(lower[5]).toBeNaN();
    expect(lower[91]).toBeNaN();
  });

  it('covers about the nominal share of new i.i.d. errors', () => {
    // common practice: empirical quantiles of exchangeable errors cover about the nominal share (split conformal, Vovk et al. 2005)
    const normal = gaussianSource(seedrandom('bands'));
    const slots = 24, zero = new Array(slots).fill(0);
    for (const coverage of [0.8, 0.9]) {
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
