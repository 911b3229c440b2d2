import { describe, expect, it } from 'vitest';
import { fitStandardiser, standardise } from '../../../src/engine/models/standardiser';
import fixture from '../../reference/fixtures/ridge-sklearn.json';

describe('fitStandardiser(rows)', () => {
  it('gives the column means and population standard deviations of scikit-learn StandardScaler', () => {
    // reference: ridge-sklearn.json mean and sd = StandardScaler().fit(x).mean_, .scale_ (scikit-learn 1.2.1, ddof = 0)
    const s = fitStandardiser(fixture.x.map((r) => Float64Array.from(r)));
    fixture.mean.forEach((v, j) => expect(s.mean[j]).toBeCloseTo(v, 12));
    fixture.sd.forEach((v, j) => expect(s.sd[j]).toBeCloseTo(v, 12));
  });

  it('divides by n, not n - 1 (population sd)', () => {
    // numpy.std([1, 2, 3, 4]) = 1.118033988749895 (numpy 1.24.2, ddof = 0); numpy.std(..., ddof=1) would be 1.2909944487358056
    const s = fitStandardiser([1, 2, 3, 4].map((v) => Float64Array.of(v)));
    expect(s.mean[0]).toBe(2.5);
    expect(s.sd[0]).toBeCloseTo(1.118033988749895, 15);
  });

  it('gives a constant column sd 1 so it maps to 0', () => {
    const s = fitStandardiser([Float64Array.of(7, 1), Float64Array.of(7, 3)]);
    expect(s.sd[0]).toBe(1);
    expect(s.mean[0]).toBe(7);
    expect(standardise(Float64Array.of(7, 2), s)[0]).toBe(0);
  });
});

describe('standardise(x, s)', () => {
  it('maps training columns to mean 0 and population sd 1', () => {
    const rows = fixture.x.map((r) => Float64Array.from(r));
    const s = fitStandardiser(rows);
    const z = rows.map((r) => standardise(r, s));
    for (let j = 0; j < 3; j++) {
      const col = z.map((r) => r[j]);
      const mean = col.reduce((a, b) => a + b, 0) / col.length;
      const sd = Math.sqrt(col.reduce((a, b) => a + (b - mean) ** 2, 0) / col.length);
      expect(mean).toBeCloseTo(0, 12);
      expect(sd).toBeCloseTo(1, 12);
    }
  });

  it('keeps NaN unknown', () => {
    const s = { mean: Float64Array.of(1), sd: Float64Array.of(2) };
    expect(standardise(Float64Array.of(NaN), s)[0]).toBeNaN();
  });
});
