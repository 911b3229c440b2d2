import { ActiveCholesky } from './lars-cholesky';

/**
 * The lasso path by least angle regression with the lasso modification
 * (Efron, Hastie, Johnstone & Tibshirani 2004, "Least angle regression",
 * Annals of Statistics 32(2), 407–499, §2 and §3.1), in Gram form: it reads
 * only XᵀX and Xᵀy, so one Gram matrix serves many targets.
 *
 * The path solves, for every α ≥ 0,
 *     minimise (1 / (2n)) ‖y − Xβ‖² + α ‖β‖₁
 * (scikit-learn's `lars_path(method='lasso')` scale, α = max|Xᵀr| / n). Pass
 * centred columns and target for a model with an intercept. The path is
 * piecewise linear in α; it returns its knots: α falls from max|Xᵀy| / n to
 * 0, a variable joins when its correlation with the residual reaches the
 * active ones', and leaves when its coefficient would change sign.
 *
 * As in scikit-learn 1.2 (`sklearn/linear_model/_least_angle.py`, read for
 * the conventions, not copied): the path ends with the knot where α falls to
 * 2⁻²³ (float32 epsilon) or below (α = 0 once every column is active), or
 * after `maxSteps` steps; a leaving variable's correlation is recomputed
 * from Xᵀy − Gβ.
 * Our choice where scikit-learn warns of "degenerate regressors": a column
 * lying in the span of the active ones (squared Cholesky pivot below
 * `pivotTolerance` × its own squared norm: e.g. a full set of weekday dummies
 * next to an intercept) cannot join until a variable leaves; its
 * coefficient stays 0. Its correlation is then tied with the active ones,
 * so the lasso optimality conditions still hold.
 *
 * @param gram  XᵀX, p × p row-major (both triangles)
 * @param xty   Xᵀy, length p
 * @param rows  n, the number of rows of X
 * @example larsLassoPath(Float64Array.of(1, 0, 0, 1), Float64Array.of(3, 1), 2, 2)
 *   // alphas [1.5, 0.5, 0]; coefs [[0,0], [2,0], [3,1]]
 */
export interface LassoPath {
  /** α at each knot, decreasing */
  alphas: Float64Array;
  /** coefficients at each knot (length p each) */
  coefs: Float64Array[];
  /** βᵀXᵀ(y − Xβ) at each knot, so that RSS = yᵀy − βᵀXᵀy − this (lars-criterion.ts) */
  residualCorrelation: Float64Array;
  /** the variables active at the end of the path, in order of entry */
  active: number[];
  /** LARS steps taken (joins and leaves) */
  steps: number;
}

export interface LarsOptions {
  /** most steps (scikit-learn's max_iter); default 500 */
  maxSteps?: number;
  /** the path ends where α falls to this; default 2⁻²³ as scikit-learn */
  alphaFloor?: number;
  /** squared pivot below this × ‖x_j‖² means x_j is in the active span; default 1e-10 */
  pivotTolerance?: number;
}

const TINY32 = 1.1754943508222875e-38; // float32 tiny: keeps a zero denominator finite, as scikit-learn

export function larsLassoPath(
  gram: Float64Array, xty: Float64Array, p: number, rows: number, options: LarsOptions = {},
): LassoPath {
  const maxSteps = options.maxSteps ?? 500;
  const floor = options.alphaFloor ?? 2 ** -23;
  const tol = options.pivotTolerance ?? 1e-10;
  const cap = Math.max(1, Math.min(p, rows)); // X has rank ≤ min(p, n): no more can be active
  const c = Float64Array.from(xty); // correlations of the columns with the residual, Xᵀ(y − Xβ)
  const beta = new Float64Array(p);
  const isActive = new Uint8Array(p);
  const dead = new Uint8Array(p); // in the active span for now
  const active = new Int32Array(cap); // active columns in order of entry: active[0..k)
  const sign = new Float64Array(cap);
  const z = new Float64Array(cap); // L⁻¹ s, grown by one entry per join
  const gA = new Float64Array(p * cap); // gA[i·cap + q] = G[i, active[q]], contiguous per row
  const chol = new ActiveCholesky(cap);
  const a = new Float64Array(p);
  let k = 0;
  const alphas: number[] = [];
  const coefs: Float64Array[] = [];
  const residualCorrelation: number[] = [];
  const knot = (alpha: number) => {
    alphas.push(alpha);
    coefs.push(Float64Array.from(beta));
    let bc = 0;
    for (let q = 0; q < k; q++) bc += beta[active[q]] * c[active[q]];
    residualCorrelation.push(bc);
  };
  const largest = (): number => {
    let best = -1, bestAbs = 0;
    for (let j = 0; j < p; j++) {
      if (isActive[j] || dead[j]) continue;
      const v = Math.abs(c[j]);
      if (v > bestAbs) { bestAbs = v; best = j; }
    }
    return best;
  };
  const join = (j: number): boolean => {
    if (k >= cap || !chol.add(gram[j * p + j], gA.subarray(j * cap, j * cap + k), tol)) return false;
    active[k] = j;
    sign[k] = c[j] > 0 ? 1 : -1;
    isActive[j] = 1;
    const rj = j * p;
    for (let i = 0; i < p; i++) gA[i * cap + k] = gram[rj + i];
    chol.forwardAt(k, sign, z);
    k++;
    return true;
  };
  const leave = (q: number) => {
    const out = active[q];
    beta[out] = 0;
    chol.remove(q);
    for (let t = q; t < k - 1; t++) { active[t] = active[t + 1]; sign[t] = sign[t + 1]; }
    for (let i = 0; i < p; i++) gA.copyWithin(i * cap + q, i * cap + q + 1, i * cap + k);
    k--;
    isActive[out] = 0;
    chol.forward(sign, z);
    // recompute the leaving column's correlation, as scikit-learn does
    let ci = xty[out];
    const ro = out * p;
    for (let t = 0; t < k; t++) ci -= gram[ro + active[t]] * beta[active[t]];
    c[out] = ci;
    // the active span shrank: a column that lay in it may now join
    for (let i = 0; i < p; i++) if (dead[i] && !chol.spans(gram[i * p + i], gA.subarray(i * cap, i * cap + k), tol)) dead[i] = 0;
  };

  let dropped = false;
  let steps = 0;
  for (;;) {
    let j = largest();
    if (!dropped) {
      while (j >= 0 && Math.abs(c[j]) / rows > floor && !join(j)) {
        dead[j] = 1;
        j = largest();
      }
    }
    // no live candidate left: with columns in the active span still out, finish at the active set's least-squares fit
    const C = j >= 0 ? Math.abs(c[j]) : k > 0 && dead.includes(1) ? Math.abs(c[active[0]]) : 0;
    const alpha = C / rows;
    if (alpha <= floor) {
      knot(alpha);
      break;
    }
    knot(alpha);
    if (steps >= maxSteps || k === 0) break;

    // equiangular direction w = A·G_AA⁻¹ s, A = (sᵀ G_AA⁻¹ s)^(-1/2) = 1 / ‖L⁻¹ s‖
    let zz = 0;
    for (let q = 0; q < k; q++) zz += z[q] * z[q];
    const A = 1 / Math.sqrt(zz);
    if (!Number.isFinite(A)) break; // the active Gram is numerically singular: end the path here
    const w = chol.backward(z);
    for (let q = 0; q < k; q++) w[q] *= A;

    // step to the next join (or to zero correlation, the least-squares fit)
    let gamma = C / A;
    for (let i = 0; i < p; i++) {
      if (isActive[i]) continue;
      const ai = dotPrefix(gA, i * cap, w, k);
      a[i] = ai;
      if (dead[i]) continue;
      const g1 = (C - c[i]) / (A - ai + TINY32);
      if (g1 > 0 && g1 < gamma) gamma = g1;
      const g2 = (C + c[i]) / (A + ai + TINY32);
      if (g2 > 0 && g2 < gamma) gamma = g2;
    }
    // lasso modification: stop where an active coefficient reaches zero
    let out = -1;
    for (let q = 0; q < k; q++) {
      const zq = -beta[active[q]] / (w[q] + TINY32);
      if (zq > 0 && zq < gamma) { gamma = zq; out = q; }
    }
    for (let q = 0; q < k; q++) {
      beta[active[q]] += gamma * w[q];
      c[active[q]] -= gamma * A * sign[q]; // G_AA w = A s
    }
    for (let i = 0; i < p; i++) if (!isActive[i]) c[i] -= gamma * a[i];
    steps++;
    dropped = out >= 0;
    if (dropped) leave(out);
  }
  return {
    alphas: Float64Array.from(alphas), coefs, residualCorrelation: Float64Array.from(residualCorrelation),
    active: Array.from(active.subarray(0, k)), steps,
  };
}

/** Σ_{q<k} x[from + q] · w[q], four terms at a time (the hot loop of a LARS step). */
function dotPrefix(x: Float64Array, from: number, w: Float64Array, k: number): number {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let q = 0;
  for (; q + 3 < k; q += 4) {
    s0 += x[from + q] * w[q];
    s1 += x[from + q + 1] * w[q + 1];
    s2 += x[from + q + 2] * w[q + 2];
    s3 += x[from + q + 3] * w[q + 3];
  }
  for (; q < k; q++) s0 += x[from + q] * w[q];
  return (s0 + s1) + (s2 + s3);
}
