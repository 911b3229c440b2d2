import type { LassoPath } from './lars-lasso';

/**
 * Picks the penalty on a lasso path by an information criterion, as
 * scikit-learn 1.2's `LassoLarsIC` does (its `fit`, read for the formula):
 *     IC_k = n log(2π σ²) + RSS_k / σ² + w · df_k
 * with w = 2 for AIC (Akaike 1974) and log n for BIC (Schwarz 1978), df_k the
 * number of non-zero coefficients at knot k (|β| > machine epsilon), an
 * unbiased estimate of the lasso's degrees of freedom (Zou, Hastie &
 * Tibshirani 2007), and σ² the noise variance (lars-noise-variance.ts, or
 * given). The first knot with the smallest IC wins.
 *
 * scikit-learn before 1.1 used σ² = var(y) (population variance) without the
 * log term; passing `noiseVariance = var(y)` gives the same choice, since the
 * log term does not depend on k.
 *
 * RSS comes from the Gram form yᵀy − βᵀXᵀy − βᵀXᵀ(y − Xβ) (centred X and y),
 * the last term kept by the path (lars-lasso.ts).
 *
 * @example lassoCriterion(path, xty, yty, p, n, σ², 'aic').best // index of the chosen knot
 */
export interface CriterionResult {
  /** IC at each knot */
  values: Float64Array;
  rss: Float64Array;
  df: Int32Array;
  /** index of the chosen knot */
  best: number;
  alpha: number;
  coef: Float64Array;
}

const EPS = 2.220446049250313e-16;

export function lassoCriterion(
  path: LassoPath, xty: Float64Array, yty: number, p: number, rows: number,
  noiseVariance: number, criterion: 'aic' | 'bic' = 'aic',
): CriterionResult {
  const weight = criterion === 'aic' ? 2 : Math.log(rows);
  const k = path.alphas.length;
  const values = new Float64Array(k), rss = new Float64Array(k), df = new Int32Array(k);
  const constant = rows * Math.log(2 * Math.PI * noiseVariance);
  let best = 0;
  for (let s = 0; s < k; s++) {
    const b = path.coefs[s];
    let count = 0, bxy = 0;
    for (let j = 0; j < p; j++) {
      if (b[j] === 0) continue;
      bxy += b[j] * xty[j];
      if (Math.abs(b[j]) > EPS) count++;
    }
    // yᵀy − 2βᵀXᵀy + βᵀGβ with Gβ = Xᵀy − Xᵀ(y − Xβ)
    rss[s] = Math.max(0, yty - bxy - path.residualCorrelation[s]);
    df[s] = count;
    values[s] = constant + rss[s] / noiseVariance + weight * df[s];
    if (values[s] < values[best]) best = s;
  }
  return { values, rss, df, best, alpha: path.alphas[best], coef: path.coefs[best] };
}
