import { describe, expect, it } from 'vitest';
import { larsLassoPath } from '../../../src/engine/linalg/lars-lasso';
import fx from '../../reference/fixtures/lars-diabetes.json';

// Data: the diabetes data of Efron et al. (2004) as bundled with scikit-learn (lars-diabetes.json);
// reference paths are checked in tests/reference/lars-sklearn.test.ts, these are properties.
function gramOf(x: number[][], y: number[]) {
  const n = x.length, p = x[0].length;
  const gram = new Float64Array(p * p), xty = new Float64Array(p);
  for (const [r, row] of x.entries()) {
    for (let i = 0; i < p; i++) {
      xty[i] += row[i] * y[r];
      for (let j = 0; j < p; j++) gram[i * p + j] += row[i] * row[j];
    }
  }
  return { gram, xty, n, p };
}

/** (1/2n)‖y − Xβ‖² + α‖β‖₁ minus its value at β, after nudging coordinate j: ≥ 0 at the optimum. */
function kktGap(g: ReturnType<typeof gramOf>, beta: Float64Array, alpha: number): number {
  // the lasso optimality conditions: |x_jᵀ r| / n ≤ α, with equality and matching sign where β_j ≠ 0
  let worst = 0;
  for (let j = 0; j < g.p; j++) {
    let c = g.xty[j];
    for (let k = 0; k < g.p; k++) c -= g.gram[j * g.p + k] * beta[k];
    c /= g.n;
    worst = Math.max(worst, beta[j] !== 0 ? Math.abs(c - Math.sign(beta[j]) * alpha) : Math.max(0, Math.abs(c) - alpha));
  }
  return worst;
}

describe('larsLassoPath(gram, xty, p, n)', () => {
  it('reproduces its doc example', () => {
    const path = larsLassoPath(Float64Array.of(1, 0, 0, 1), Float64Array.of(3, 1), 2, 2);
    expect(Array.from(path.alphas)).toEqual([1.5, 0.5, 0]);
    expect(path.coefs.map((c) => Array.from(c))).toEqual([[0, 0], [2, 0], [3, 1]]);
  });

  it('meets the lasso optimality conditions at every knot (Efron et al. 2004, Lemma 8)', () => {
    const g = gramOf(fx.x, fx.y);
    const path = larsLassoPath(g.gram, g.xty, g.p, g.n);
    path.alphas.forEach((alpha, k) => expect(kktGap(g, path.coefs[k], alpha)).toBeLessThan(1e-9));
  });

  it('keeps a duplicated column out and otherwise follows the path without it', () => {
    const x2 = fx.x.map((r) => [...r, r[2]]); // column 2 (bmi) twice
    const plain = gramOf(fx.x, fx.y), twice = gramOf(x2, fx.y);
    const a = larsLassoPath(plain.gram, plain.xty, plain.p, plain.n);
    const b = larsLassoPath(twice.gram, twice.xty, twice.p, twice.n);
    expect(b.alphas.length).toBe(a.alphas.length);
    b.alphas.forEach((alpha, k) => expect(alpha).toBeCloseTo(a.alphas[k], 10));
    b.coefs.forEach((c, k) => {
      expect(c[10]).toBe(0);
      for (let j = 0; j < 10; j++) expect(c[j]).toBeCloseTo(a.coefs[k][j], 6);
    });
  });

  it('stops after maxSteps and passes over all-zero columns', () => {
    const g = gramOf(fx.x.map((r) => [0, ...r]), fx.y);
    const short = larsLassoPath(g.gram, g.xty, g.p, g.n, { maxSteps: 3 });
    expect(short.steps).toBe(3);
    expect(short.alphas).toHaveLength(4);
    const full = larsLassoPath(g.gram, g.xty, g.p, g.n);
    expect(full.coefs.every((c) => c[0] === 0)).toBe(true);
    expect(full.active).not.toContain(0);
  });

  it('gives the single knot α = 0, β = 0 for a target without correlation to any column', () => {
    const path = larsLassoPath(Float64Array.of(2, 1, 1, 2), Float64Array.of(0, 0), 2, 5);
    expect(Array.from(path.alphas)).toEqual([0]);
    expect(Array.from(path.coefs[0])).toEqual([0, 0]);
  });
});
