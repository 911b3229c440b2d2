import { describe, expect, it } from 'vitest';
import { lassoCriterion } from '../../../src/engine/linalg/lars-criterion';
import type { LassoPath } from '../../../src/engine/linalg/lars-lasso';

// The formula of scikit-learn 1.2's LassoLarsIC (values checked in tests/reference/lars-sklearn.test.ts);
// here a hand-made two-knot path of the problem X = I (2 × 2), y = (3, 1).
const path: LassoPath = {
  alphas: Float64Array.of(1.5, 0.5, 0),
  coefs: [Float64Array.of(0, 0), Float64Array.of(2, 0), Float64Array.of(3, 1)],
  residualCorrelation: Float64Array.of(0, 2, 0), // βᵀXᵀ(y − Xβ)
  active: [0, 1],
  steps: 2,
};
const xty = Float64Array.of(3, 1);

describe('lassoCriterion(path, xty, yty, p, n, σ², criterion)', () => {
  it('computes n log(2πσ²) + RSS/σ² + w·df at each knot and picks the smallest', () => {
    const r = lassoCriterion(path, xty, 10, 2, 2, 1, 'aic');
    expect(Array.from(r.rss)).toEqual([10, 2, 0]);
    expect(Array.from(r.df)).toEqual([0, 1, 2]);
    const c = 2 * Math.log(2 * Math.PI);
    expect(Array.from(r.values)).toEqual([c + 10, c + 2 + 2, c + 0 + 4]);
    expect(r.best).toBe(1);
    expect(r.alpha).toBe(0.5);
    expect(Array.from(r.coef)).toEqual([2, 0]);
  });

  it('weighs df by log n for BIC and takes the first of equal values', () => {
    const bic = lassoCriterion(path, xty, 10, 2, 2, 1, 'bic');
    expect(bic.values[2] - bic.values[1]).toBeCloseTo(-2 + Math.log(2), 12);
    const tie = lassoCriterion(path, xty, 10, 2, 2, 2, 'aic'); // RSS/2 + 2 df: 5, 3, 4
    expect(tie.best).toBe(1);
  });

  it('counts as degrees of freedom only coefficients above machine epsilon', () => {
    const tiny: LassoPath = { ...path, coefs: [Float64Array.of(1e-17, 0), path.coefs[1], path.coefs[2]] };
    expect(lassoCriterion(tiny, xty, 10, 2, 2, 1, 'aic').df[0]).toBe(0);
  });
});
