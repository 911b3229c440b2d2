/**
 * The noise variance that an information criterion on a lasso path needs,
 * estimated by ordinary least squares on all columns, as scikit-learn 1.2's
 * `LassoLarsIC` does when `noise_variance` is not given:
 *     σ² = ‖y − X β_OLS‖² / (n − p − 1)       (centred X and y, intercept)
 * (Zou, Hastie & Tibshirani 2007, "On the degrees of freedom of the lasso",
 * Annals of Statistics 35(5), §2; scikit-learn's `_estimate_noise_variance`).
 *
 * Rank-deficient X (a full set of weekday dummies beside the intercept) is
 * allowed: the residual is that of the projection on X's column space, as a
 * minimum-norm least-squares solver gives; columns whose Cholesky pivot
 * falls below `tol` × their squared norm are passed over. The divisor keeps
 * all p columns, as scikit-learn does.
 *
 * One factorisation serves many targets that share X (`xtys`, `ytys`).
 *
 * @param gram XᵀX (p × p row-major), xtys Xᵀy per target, ytys yᵀy per target
 * @returns σ² per target, or undefined when n ≤ p + 1 (no degrees of freedom left)
 * @example olsNoiseVariance(Float64Array.of(2), [Float64Array.of(2)], [3], 1, 4) // [0.5]: RSS 3 − 2²/2 = 1 over n − p − 1 = 2
 */
export function olsNoiseVariance(
  gram: Float64Array, xtys: Float64Array[], ytys: number[], p: number, rows: number, tol = 1e-10,
): Float64Array | undefined {
  const dof = rows - p - 1;
  if (dof <= 0) return undefined;
  const rss = projectionRss(gram, xtys, ytys, p, tol);
  return rss.map((r) => r / dof);
}

/** ‖y − P_X y‖² per target, from the Gram form: yᵀy − ‖L⁻¹ Xᵀy‖² over the columns kept. */
export function projectionRss(gram: Float64Array, xtys: Float64Array[], ytys: number[], p: number, tol = 1e-10): Float64Array {
  const l = new Float64Array(p * p);
  const kept: number[] = [];
  for (let j = 0; j < p; j++) {
    const gjj = gram[j * p + j];
    if (!(gjj > 0)) continue;
    const row = j * p;
    let ss = 0;
    for (let i = 0; i < kept.length; i++) {
      const ki = kept[i];
      let v = gram[j * p + ki];
      const ri = ki * p;
      for (let t = 0; t < i; t++) v -= l[ri + kept[t]] * l[row + kept[t]];
      v /= l[ri + ki];
      l[row + ki] = v;
      ss += v * v;
    }
    const pivot = gjj - ss;
    if (pivot > tol * gjj) {
      l[row + j] = Math.sqrt(pivot);
      kept.push(j);
    } else for (const ki of kept) l[row + ki] = 0;
  }
  const out = new Float64Array(xtys.length);
  const z = new Float64Array(p);
  xtys.forEach((xty, m) => {
    let explained = 0;
    for (let i = 0; i < kept.length; i++) {
      const ki = kept[i];
      let v = xty[ki];
      const ri = ki * p;
      for (let t = 0; t < i; t++) v -= l[ri + kept[t]] * z[t];
      v /= l[ri + ki];
      z[i] = v;
      explained += v * v;
    }
    out[m] = Math.max(0, ytys[m] - explained);
  });
  return out;
}
