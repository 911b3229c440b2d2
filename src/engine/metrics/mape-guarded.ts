import { InputError } from '../errors';
import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

export interface MapeOptions {
  /** Pairs whose |actual| is below this are left out (default 1, in currency/MWh). */
  minAbsActual?: number;
}

export interface MapeResult {
  /** MAPE in percent over the pairs that passed the guard. */
  value: number;
  /** Number of complete pairs used. */
  used: number;
  /** Number of complete pairs left out because |actual| < minAbsActual. */
  skipped: number;
}

/**
 * Mean absolute percentage error with a guard for prices near zero:
 * 100 * mean(|F - A| / |A|) over the pairs with |A| >= minAbsActual. Day-ahead
 * prices can be zero or negative, where the plain MAPE divides by (almost)
 * zero; such pairs are left out and counted in `skipped`. Pairs with a NaN are
 * skipped and not counted there.
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @param options - `minAbsActual`, a positive number (default 1)
 * @returns `{ value, used, skipped }`
 * @throws {InputError} on different lengths, ±Infinity, no complete pair, a
 *   bad `minAbsActual`, when every complete pair fails the guard, or a result
 *   that overflows (finite-score.ts)
 * @example mapeGuarded([100, 0.2, -50], [90, 5, -40]) // { value: 15, used: 2, skipped: 1 }
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4);
 * the guard is ours (common practice: report how many periods it removed).
 */
export function mapeGuarded(
  actual: readonly number[],
  forecast: readonly number[],
  { minAbsActual = 1 }: MapeOptions = {},
): MapeResult {
  if (!(minAbsActual > 0 && Number.isFinite(minAbsActual))) {
    throw new InputError(`MAPE minAbsActual must be a positive number (got ${minAbsActual})`);
  }
  const [a, f] = validRows('MAPE', ['actual', 'forecast'], [actual, forecast]);
  let sum = 0;
  let used = 0;
  for (let i = 0; i < a.length; i++) {
    if (Math.abs(a[i]) < minAbsActual) continue;
    sum += Math.abs(f[i] - a[i]) / Math.abs(a[i]);
    used++;
  }
  if (used === 0) {
    throw new InputError(
      `MAPE requires at least 1 actual value with |actual| >= ${minAbsActual} (all ${a.length} are closer to zero); use sMAPE or MAE for prices near zero`,
    );
  }
  return { value: finiteScore('MAPE', (100 * sum) / used), used, skipped: a.length - used };
}
