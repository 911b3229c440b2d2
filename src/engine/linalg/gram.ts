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

/** Adds one row x (length p) with targets y (length m); weight −1 takes a row out again. */
export function addRow(g: Gram, x: ArrayLike<number>, y: ArrayLike<number>, weight: 1 | -1 = 1): void {
  const { p, m, xtx, xty } = g;
  for (let i = 0; i < p; i++) {
    const xi = x[i] * weight;
    if (xi === 0) continue;
    const ri = i * p;
    for (let j = 0; j <= i; j++) xtx[ri + j] += xi * x[j];
    const ci = i * m;
    for (let c = 0; c < m; c++) xty[ci + c] += xi * y[c];
  }
  g.rows += weight;
}
