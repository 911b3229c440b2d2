import { describe, expect, it } from 'vitest';
import { lassoCriterion } from '../../src/engine/linalg/lars-criterion';
import { larsLassoPath, type LassoPath } from '../../src/engine/linalg/lars-lasso';
import { olsNoiseVariance } from '../../src/engine/linalg/lars-noise-variance';
import fx from './fixtures/lars-diabetes.json';

// Reference: lars-diabetes.json, scikit-learn 1.2.1 (Debian python3-sklearn, numpy 1.24.2) on the
// diabetes data of Efron, Hastie, Johnstone & Tibshirani (2004) bundled with scikit-learn; calls
// in the file and the script make-lars-fixtures.py (README-lars-fixtures.md).

function gramOf(x: number[][], y: number[], centre: boolean) {
  const n = x.length, p = x[0].length;
  const xm = x[0].map((_, j) => (centre ? x.reduce((s, r) => s + r[j], 0) / n : 0));
  const ym = centre ? y.reduce((s, v) => s + v, 0) / n : 0;
  const gram = new Float64Array(p * p), xty = new Float64Array(p);
  let yty = 0;
  for (let r = 0; r < n; r++) {
    const yr = y[r] - ym;
    yty += yr * yr;
    for (let i = 0; i < p; i++) {
      const xi = x[r][i] - xm[i];
      xty[i] += xi * yr;
      for (let j = 0; j < p; j++) gram[i * p + j] += xi * (x[r][j] - xm[j]);
    }
  }
  return { gram, xty, yty, n, p };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

function expectPath(path: LassoPath, expected: { alphas: number[]; active: number[]; coefs: number[][] }, coefScale: number) {
  expect(path.active).toEqual(expected.active);
  expect(path.alphas.length).toBe(expected.alphas.length);
  expected.alphas.forEach((a, k) => {
    // the last knot lies at the end of the path, α ≈ 0: there only rounding is left
    if (a > 1e-9) expect(rel(path.alphas[k], a)).toBeLessThan(1e-8);
    else expect(path.alphas[k]).toBeLessThan(1e-9);
  });
  expected.coefs.forEach((row, k) => row.forEach((b, j) => {
    expect(Math.abs(path.coefs[k][j] - b)).toBeLessThanOrEqual(1e-8 * Math.max(Math.abs(b), coefScale));
  }));
}

describe('larsLassoPath(gram, xty, p, n) against scikit-learn lars_path(method="lasso")', () => {
  it('gives the knots, the order of entry and the coefficients on the diabetes data', () => {
    const g = gramOf(fx.x, fx.y, false);
    const path = larsLassoPath(g.gram, g.xty, g.p, g.n);
    expectPath(path, fx.path, 1e-6);
    // Efron et al. 2004, §3.1 (from memory): on these data the lasso path takes 12 steps against LARS's 10,
    // because variable 7 (hdl, index 6) leaves once and joins again
    expect(path.steps).toBe(12);
    expect([9, 10, 11, 12].map((k) => path.coefs[k][6] !== 0)).toEqual([true, false, false, true]);
  });

  it('gives the same path on the unscaled diabetes columns (age in years, bmi, …)', () => {
    const g = gramOf(fx.xRaw, fx.y, true);
    expectPath(larsLassoPath(g.gram, g.xty, g.p, g.n), fx.pathRaw, 1e-6);
  });

  it('ends at a zero residual with 7 of 10 columns active on 8 centred rows (fewer rows than columns)', () => {
    const g = gramOf(fx.x.slice(0, 8), fx.y.slice(0, 8), true);
    const path = larsLassoPath(g.gram, g.xty, g.p, g.n);
    expectPath(path, fx.pathWide, 1e-3);
    expect(path.active).toHaveLength(7);
  });
});

describe('lassoCriterion and olsNoiseVariance against scikit-learn LassoLarsIC', () => {
  const cases = [
    ['aic', fx.aic, fx.x, 'aic'],
    ['bic', fx.bic, fx.x, 'bic'],
    ['aicRaw', fx.aicRaw, fx.xRaw, 'aic'],
  ] as const;

  it.each(cases)('%s: noise variance, criterion at every knot, chosen alpha, coefficients and intercept', (_, ref, x, criterion) => {
    const g = gramOf(x, fx.y, true);
    const sigma2 = olsNoiseVariance(g.gram, [g.xty], [g.yty], g.p, g.n)![0];
    expect(rel(sigma2, ref.noiseVariance)).toBeLessThan(1e-10);
    const path = larsLassoPath(g.gram, g.xty, g.p, g.n);
    const pick = lassoCriterion(path, g.xty, g.yty, g.p, g.n, sigma2, criterion);
    expect(pick.values.length).toBe(ref.criterion.length);
    ref.criterion.forEach((v, k) => expect(rel(pick.values[k], v)).toBeLessThan(1e-9));
    expect(rel(pick.alpha, ref.alpha)).toBeLessThan(1e-8);
    ref.coef.forEach((b, j) => expect(Math.abs(pick.coef[j] - b)).toBeLessThanOrEqual(1e-8 * Math.max(Math.abs(b), 1e-6)));
    const xm = x[0].map((_, j) => x.reduce((s, r) => s + r[j], 0) / x.length);
    const intercept = fx.y.reduce((s, v) => s + v, 0) / fx.y.length - pick.coef.reduce((s, b, j) => s + b * xm[j], 0);
    expect(rel(intercept, ref.intercept)).toBeLessThan(1e-9);
  });

  it('with noise_variance = var(y) (the choice of scikit-learn before 1.1) picks as LassoLarsIC(noise_variance=np.var(y))', () => {
    const g = gramOf(fx.x, fx.y, true);
    const path = larsLassoPath(g.gram, g.xty, g.p, g.n);
    const pick = lassoCriterion(path, g.xty, g.yty, g.p, g.n, g.yty / g.n, 'aic');
    expect(rel(pick.alpha, fx.aicVarY.alpha)).toBeLessThan(1e-8);
    fx.aicVarY.criterion.forEach((v, k) => expect(rel(pick.values[k], v)).toBeLessThan(1e-9));
    // a larger noise variance than the least-squares one: a sparser model
    expect(pick.alpha).toBeGreaterThan(fx.aic.alpha);
  });
});
