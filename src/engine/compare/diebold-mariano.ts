import { InputError } from '../errors';
import { studentTCdf } from './student-t-cdf';

export interface DieboldMarianoOptions {
  /** Forecast horizon: autocovariances up to lag h - 1 enter the variance (default 1). */
  h?: number;
}

export interface DieboldMarianoResult {
  /** HLN-corrected statistic; negative when A has the smaller loss on average. */
  statistic: number;
  /** One-sided p-value for H1 "A is more accurate than B" (mean d < 0). */
  pValue: number;
  /** Number of loss differences used (NaN entries are skipped). */
  n: number;
}

/**
 * Diebold–Mariano test of equal predictive accuracy with the Harvey,
 * Leybourne & Newbold small-sample correction. Input is the loss differential
 * d_t = loss(A)_t - loss(B)_t. With d̄ its mean and γ_k its lag-k
 * autocovariance (divisor n), the statistic is
 * d̄ / sqrt((γ_0 + 2 Σ_{k=1}^{h-1} γ_k) / n) · sqrt((n + 1 - 2h + h(h-1)/n) / n),
 * compared with Student's t with n - 1 degrees of freedom. The p-value is
 * one-sided, P(T <= statistic): small when A is more accurate than B; the
 * p-value for "B more accurate than A" is 1 - pValue.
 *
 * NaN entries are skipped (for h > 1 the remaining values are then treated as
 * consecutive). If every d_t is 0 the forecasts are equally accurate on every
 * period: the result is statistic 0, p-value 0.5 (no evidence either way).
 *
 * @param lossDiff - d_t, oldest first
 * @param options - `h`, a whole number from 1 to n - 1 (default 1)
 * @returns `{ statistic, pValue, n }`
 * @throws {InputError} on fewer than 2 values, ±Infinity, a bad h, a loss
 *   differential that is constant but not zero (variance 0: the test is
 *   undefined), or a negative long-run variance estimate (h > 1)
 * @example dieboldMariano([-1, -2, 0.5, -1.5]).pValue // 0.081 (A better, weakly)
 * Source: Diebold & Mariano (1995), JBES 13(3); Harvey, Leybourne & Newbold
 * (1997), Int. J. Forecasting 13(2); same computation as R forecast::dm.test().
 */
export function dieboldMariano(
  lossDiff: readonly number[],
  { h = 1 }: DieboldMarianoOptions = {},
): DieboldMarianoResult {
  const raw = lossDiff.filter((v) => !Number.isNaN(v));
  const bad = raw.find((v) => !Number.isFinite(v));
  if (bad !== undefined) {
    throw new InputError(`Diebold–Mariano test: a loss difference is ${bad}; give finite numbers, or NaN for unknown`);
  }
  // The statistic does not depend on the unit of d: divided by a power of two
  // (exact) the largest |d| is about 1, so squares neither overflow nor underflow.
  const unit = powerOfTwoBelow(raw.reduce((m, v) => Math.max(m, Math.abs(v)), 0));
  const d = raw.map((v) => v / unit);
  const n = d.length;
  if (n < 2) {
    throw new InputError(`Diebold–Mariano test requires at least 2 loss differences (got ${n})`);
  }
  if (!(Number.isInteger(h) && h >= 1 && h <= n - 1)) {
    throw new InputError(`Diebold–Mariano test: h must be a whole number from 1 to ${n - 1} (got ${h})`);
  }
  if (raw.every((v) => v === raw[0])) {
    if (raw[0] === 0) return { statistic: 0, pValue: 0.5, n };
    throw new InputError(
      `Diebold–Mariano test is undefined: the loss difference is ${raw[0]} in every period, so its variance is 0`,
    );
  }
  const mean = d.reduce((s, v) => s + v, 0) / n;
  let longRun = autocovariance(d, mean, 0);
  for (let k = 1; k < h; k++) longRun += 2 * autocovariance(d, mean, k);
  if (!(longRun > 0)) {
    throw new InputError(
      `Diebold–Mariano test: the long-run variance estimate is not positive with h = ${h}; use a smaller h`,
    );
  }
  const correction = Math.sqrt((n + 1 - 2 * h + (h * (h - 1)) / n) / n);
  const statistic = (mean / Math.sqrt(longRun / n)) * correction;
  return { statistic, pValue: studentTCdf(statistic, n - 1), n };
}

function autocovariance(d: readonly number[], mean: number, lag: number): number {
  let sum = 0;
  for (let t = lag; t < d.length; t++) sum += (d[t] - mean) * (d[t - lag] - mean);
  return sum / d.length;
}

/** The largest power of two not above m (1 for m = 0), finite for every finite m. */
function powerOfTwoBelow(m: number): number {
  if (m === 0) return 1;
  let e = Math.min(1023, Math.floor(Math.log2(m)));
  if (2 ** e > m) e--; // log2 can round up just below a power of two
  return 2 ** e;
}
