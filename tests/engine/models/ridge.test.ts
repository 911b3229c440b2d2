import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/engine';
import { addRidgeDay, predictRidge, ridgeGram, ridgeRow, solveRidge } from '../../../src/engine/models/ridge';
import { fitStandardiser } from '../../../src/engine/models/standardiser';
import fixture from '../../reference/fixtures/ridge-sklearn.json';

const xs = fixture.x.map((r) => Float64Array.from(r));
const ys = fixture.y.map((r) => Float64Array.from(r));
const n = xs.length, p = 3, m = 2;

describe('solveRidge(gram, lambda) against scikit-learn', () => {
  // reference: ridge-sklearn.json — scikit-learn 1.2.1
  // Ridge(alpha=lambda * n, fit_intercept=True, solver='cholesky') on StandardScaler inputs (script in README-engine-fixtures.md).
  // solveRidge scales λ by the row count and leaves the intercept unpenalised, which is that call.
  const s = fitStandardiser(xs);
  const gram = ridgeGram(xs, ys, s);

  it.each(fixture.cases.map((c) => [c.lambda, c] as const))('λ = %s gives the coefficients and intercept of Ridge(alpha = λ·n)', (lambda, c) => {
    const w = solveRidge(gram, lambda);
    expect(w).toHaveLength((p + 1) * m);
    // weights are stored as float32 (Math.fround): relative 2^-24 of their size, plus the 1e-9·n guard on the intercept
    for (let j = 0; j < p; j++) for (let k = 0; k < m; k++) expect(w[j * m + k]).toBeCloseTo(c.coef[k][j], 5);
    for (let k = 0; k < m; k++) expect(w[p * m + k]).toBeCloseTo(c.intercept[k], 5);
  });

  it.each(fixture.cases.map((c) => [c.lambda, c] as const))('λ = %s predicts new rows like Ridge.predict', (lambda, c) => {
    const w = solveRidge(gram, lambda);
    fixture.xnew.forEach((x, i) => {
      const f = predictRidge(w, s, Float64Array.from(x), m);
      for (let k = 0; k < m; k++) expect(f[k]).toBeCloseTo(c.predict[i][k], 5);
    });
  });

  it('stores float32 coefficients', () => {
    for (const v of solveRidge(gram, 0.05)) expect(Math.fround(v)).toBe(v);
  });

  it('is the same penalty per row for any span: doubling every row leaves the fit unchanged', () => {
    const twice = ridgeGram([...xs, ...xs], [...ys, ...ys], s);
    const once = solveRidge(gram, 0.05);
    solveRidge(twice, 0.05).forEach((v, i) => expect(v).toBeCloseTo(once[i], 5));
  });

  it('refuses degenerate inputs with an InputError', () => {
    // no rows: XᵀX = 0 and the penalty λ·0 = 0, so nothing is positive definite
    const empty = ridgeGram([xs[0]], [ys[0]], s);
    empty.xtx.fill(0); empty.rows = 0;
    expect(() => solveRidge(empty, 0.1)).toThrow(InputError);
    expect(() => solveRidge(empty, 0.1)).toThrow(/could not be fitted/);
  });
});

describe('ridgeRow(x, s), ridgeGram, addRidgeDay', () => {
  const s = fitStandardiser(xs);

  it('ridgeRow is the standardised row with a trailing 1 for the intercept', () => {
    const row = ridgeRow(xs[0], s);
    expect(row).toHaveLength(p + 1);
    for (let j = 0; j < p; j++) expect(row[j]).toBeCloseTo((fixture.x[0][j] - fixture.mean[j]) / fixture.sd[j], 12);
    expect(row[p]).toBe(1);
  });

  it('addRidgeDay after ridgeGram on fewer days gives the sums of all days', () => {
    const r = { gram: ridgeGram(xs.slice(0, n - 5), ys.slice(0, n - 5), s) };
    for (let i = n - 5; i < n; i++) addRidgeDay(r.gram, s, xs[i], ys[i]);
    const all = ridgeGram(xs, ys, s);
    expect(r.gram.rows).toBe(n);
    r.gram.xtx.forEach((v, i) => expect(v).toBeCloseTo(all.xtx[i], 10));
    r.gram.xty.forEach((v, i) => expect(v).toBeCloseTo(all.xty[i], 10));
  });
});
