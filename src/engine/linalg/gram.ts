/**
 * Running sums of a least-squares problem: XᵀX (p × p), XᵀY (p × m) and the
 * row count, so rows can be added one day at a time without keeping X.
 */
export interface Gram {
  p: number;
  m: number;
  xtx: Float64Array;
  xty: Float64Array;
  rows: number;
}

export function emptyGram(p: number, m: number): Gram {
  return { p, m, xtx: new Float64Array(p * p), xty: new Float64Array(p * m), rows: 0 };
}

/** Adds one row x (length p) with targets y (length m). */
export function addRow(g: Gram, x: ArrayLike<number>, y: ArrayLike<number>): void {
  const { p, m, xtx, xty } = g;
  for (let i = 0; i < p; i++) {
    const xi = x[i];
    if (xi === 0) continue;
    const ri = i * p;
    for (let j = 0; j <= i; j++) xtx[ri + j] += xi * x[j];
    const ci = i * m;
    for (let c = 0; c < m; c++) xty[ci + c] += xi * y[c];
  }
  g.rows++;
}

/** XᵀX + λ I as a full symmetric matrix (addRow fills only the lower triangle). */
export function penalised(g: Gram, lambda: number): Float64Array {
  const { p, xtx } = g;
  const a = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) { a[i * p + j] = xtx[i * p + j]; a[j * p + i] = xtx[i * p + j]; }
    a[i * p + i] += lambda;
  }
  return a;
}
