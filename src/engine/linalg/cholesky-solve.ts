/**
 * Solves A X = B for a symmetric positive-definite A (p × p, row-major
 * Float64Array) and B (p × m, row-major) by the Cholesky factorisation
 * A = L Lᵀ (Golub & Van Loan, Matrix Computations, 4th ed., §4.2).
 *
 * @returns X (p × m, row-major), or undefined when A is not positive definite
 * @example choleskySolve(Float64Array.of(4, 2, 2, 3), Float64Array.of(2, 1), 2, 1) // [0.5, 0]
 */
export function choleskySolve(a: Float64Array, b: Float64Array, p: number, m: number): Float64Array | undefined {
  const l = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = a[i * p + j];
      const li = i * p, lj = j * p;
      for (let k = 0; k < j; k++) sum -= l[li + k] * l[lj + k];
      if (i === j) {
        if (!(sum > 0)) return undefined;
        l[li + i] = Math.sqrt(sum);
      } else l[li + j] = sum / l[lj + j];
    }
  }
  const x = Float64Array.from(b);
  // forward: L y = b
  for (let i = 0; i < p; i++) {
    for (let k = 0; k < i; k++) {
      const lik = l[i * p + k];
      if (lik !== 0) for (let c = 0; c < m; c++) x[i * m + c] -= lik * x[k * m + c];
    }
    const lii = l[i * p + i];
    for (let c = 0; c < m; c++) x[i * m + c] /= lii;
  }
  // backward: Lᵀ x = y
  for (let i = p - 1; i >= 0; i--) {
    for (let k = i + 1; k < p; k++) {
      const lki = l[k * p + i];
      if (lki !== 0) for (let c = 0; c < m; c++) x[i * m + c] -= lki * x[k * m + c];
    }
    const lii = l[i * p + i];
    for (let c = 0; c < m; c++) x[i * m + c] /= lii;
  }
  return x;
}
