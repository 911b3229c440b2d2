/**
 * A Cholesky factor G_AA = L Lᵀ of the active columns of a Gram matrix that
 * grows by one column and shrinks by any column, as the LARS path needs
 * (Efron, Hastie, Johnstone & Tibshirani 2004, "Least angle regression",
 * Annals of Statistics 32(2), §7: "the Cholesky factorization … can be
 * updated"). Adding a column is one forward substitution; removing one is a
 * row shift and Givens rotations (Golub & Van Loan, Matrix Computations,
 * 4th ed., §6.5.4 and §5.1.8). Both cost O(k²) for k active columns.
 *
 * L lives in a preallocated `capacity × capacity` row-major buffer.
 *
 * @example
 *   const f = new ActiveCholesky(3);
 *   f.add(4, [], 1e-10);          // G = [[4]]          → L = [[2]]
 *   f.add(3, [2], 1e-10);         // G = [[4,2],[2,3]]  → L = [[2,0],[1,√2]]
 *   f.solve(Float64Array.of(2, 1)) // [0.5, 0]
 */
export class ActiveCholesky {
  private readonly l: Float64Array;
  /** number of active columns */
  size = 0;

  constructor(readonly capacity: number) {
    this.l = new Float64Array(capacity * capacity);
  }

  /**
   * Appends a column with diagonal entry `gjj` and cross products `gaj` with
   * the active columns (in their order).
   * @returns false, leaving the factor as it was, when the column lies (to
   *   relative tolerance `tol` on the squared pivot) in the span of the active ones
   */
  add(gjj: number, gaj: ArrayLike<number>, tol: number): boolean {
    const k = this.size, m = this.capacity, l = this.l;
    const row = k * m;
    let ss = 0;
    for (let i = 0; i < k; i++) {
      let v = gaj[i];
      const ri = i * m;
      for (let t = 0; t < i; t++) v -= l[ri + t] * l[row + t];
      v /= l[ri + i];
      l[row + i] = v;
      ss += v * v;
    }
    const pivot = gjj - ss;
    if (!(gjj > 0) || !(pivot > tol * gjj)) {
      for (let i = 0; i < k; i++) l[row + i] = 0;
      return false;
    }
    l[row + k] = Math.sqrt(pivot);
    this.size = k + 1;
    return true;
  }

  /** True when a column (as for `add`) lies in the span of the active ones; the factor is not changed. */
  spans(gjj: number, gaj: ArrayLike<number>, tol: number): boolean {
    if (!this.add(gjj, gaj, tol)) return true;
    this.size--;
    const row = this.size * this.capacity;
    for (let i = 0; i <= this.size; i++) this.l[row + i] = 0;
    return false;
  }

  /** Removes the column at position `i` (0-based, in order of entry). */
  remove(i: number): void {
    const k = this.size, m = this.capacity, l = this.l;
    // shift the rows below i up by one: the result is lower Hessenberg from column i on
    for (let r = i; r < k - 1; r++) {
      const to = r * m, from = (r + 1) * m;
      for (let c = 0; c <= r + 1; c++) l[to + c] = l[from + c];
    }
    for (let c = 0; c < m; c++) l[(k - 1) * m + c] = 0;
    // rotate column pairs (c, c+1) so that row c loses its entry above the diagonal
    for (let c = i; c < k - 1; c++) {
      const a = l[c * m + c], b = l[c * m + c + 1];
      const r = Math.hypot(a, b);
      const cs = a / r, sn = b / r;
      for (let q = c; q < k - 1; q++) {
        const x = l[q * m + c], y = l[q * m + c + 1];
        l[q * m + c] = cs * x + sn * y;
        l[q * m + c + 1] = -sn * x + cs * y;
      }
      l[c * m + c + 1] = 0;
    }
    for (let r = 0; r < k - 1; r++) l[r * m + k - 1] = 0;
    this.size = k - 1;
  }

  /** Solves G_AA u = b for the active columns (b of length size); returns a new array. */
  solve(b: ArrayLike<number>): Float64Array {
    const z = new Float64Array(this.size);
    this.forward(b, z);
    return this.backward(z);
  }

  /** z = L⁻¹ b, written into z (length ≥ size). */
  forward(b: ArrayLike<number>, z: Float64Array): void {
    for (let i = 0; i < this.size; i++) this.forwardAt(i, b, z);
  }

  /** Entry i of L⁻¹ b, given entries 0..i-1 already in z: after `add`, z grows by one in O(k). */
  forwardAt(i: number, b: ArrayLike<number>, z: Float64Array): void {
    const l = this.l, ri = i * this.capacity;
    let v = b[i];
    for (let t = 0; t < i; t++) v -= l[ri + t] * z[t];
    z[i] = v / l[ri + i];
  }

  /** u with Lᵀ u = z (z of length ≥ size); returns a new array. */
  backward(z: ArrayLike<number>): Float64Array {
    const k = this.size, m = this.capacity, l = this.l;
    const u = new Float64Array(k);
    for (let i = 0; i < k; i++) u[i] = z[i];
    // by rows of L: each solved entry is taken out of the ones above it (contiguous reads)
    for (let i = k - 1; i >= 0; i--) {
      const ri = i * m;
      const ui = u[i] / l[ri + i];
      u[i] = ui;
      if (ui !== 0) for (let t = 0; t < i; t++) u[t] -= l[ri + t] * ui;
    }
    return u;
  }

  /** The factor's entry L[i][j] (for tests). */
  at(i: number, j: number): number {
    return this.l[i * this.capacity + j];
  }
}
