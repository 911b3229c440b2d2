import { describe, expect, it } from 'vitest';
import { fromAsinh, MAD_TO_SD, robustScale, toAsinh } from '../../../src/engine/models/lear-scale';
import r from '../../reference/fixtures/r-quantile-mad.json';

describe('robustScale(values)', () => {
  it('takes the median and the normal-consistent MAD, as R median() and mad(constant = 1) × 1/qnorm(3/4)', () => {
    // reference: r-quantile-mad.json (R 4.2.2; calls in README-engine-fixtures.md). R's default constant is
    // 1.4826 rounded; statsmodels' robust.mad, used by the published LEAR code, divides by Φ⁻¹(3/4) = 0.6744897501960817
    for (const c of [r.mad, r.madOdd]) {
      const values = 'prices' in c ? (c as typeof r.mad).prices : r.madOdd.x;
      const s = robustScale(Float64Array.from(values));
      expect(s.centre).toBe(c.median);
      if ('madRaw' in c) expect(s.scale).toBeCloseTo((c as typeof r.mad).madRaw * MAD_TO_SD, 12);
      expect(s.scale / c.mad).toBeCloseTo(MAD_TO_SD / 1.4826, 12);
    }
    expect(MAD_TO_SD).toBeCloseTo(1.4826, 4);
  });

  it('reproduces its doc example', () => {
    expect(robustScale(Float64Array.of(1, 2, 3, 4, 100))).toEqual({ centre: 3, scale: MAD_TO_SD });
  });

  it('falls back to the population standard deviation where more than half the values are equal, and to 1 for a constant', () => {
    const night = Float64Array.of(0, 0, 0, 0, 0, 2, 4); // a solar forecast around dawn
    const mean = 6 / 7;
    const sd = Math.sqrt((5 * mean ** 2 + (2 - mean) ** 2 + (4 - mean) ** 2) / 7);
    expect(robustScale(night)).toEqual({ centre: 0, scale: sd });
    expect(robustScale(Float64Array.of(7, 7, 7))).toEqual({ centre: 7, scale: 1 });
  });

  it('toAsinh and fromAsinh invert each other (Uniejewski, Kowalski & Weron 2018)', () => {
    const s = { centre: 40, scale: 12 };
    for (const p of [-500, -3, 0, 40, 95.5, 3000]) expect(fromAsinh(toAsinh(p, s), s)).toBeCloseTo(p, 9);
    expect(toAsinh(52, s)).toBe(Math.asinh(1));
  });
});
