import { validRows } from './valid-rows';

/**
 * Symmetric mean absolute percentage error, in percent:
 * 100 * mean(2 |F - A| / (|A| + |F|)), between 0 and 200. Pairs with a NaN are
 * skipped; a pair with A = F = 0 (so |A| + |F| = 0) is a perfect forecast and
 * counts as 0. The absolute values in the denominator keep the measure
 * between 0 and 200 when prices are negative.
 *
 * @param actual - observed prices (may be zero or negative)
 * @param forecast - forecast prices, same length as `actual`
 * @returns the sMAPE in percent
 * @throws {InputError} on different lengths, ±Infinity, or no complete pair
 * @example smape([100, 0], [50, 0]) // 33.33... (= (66.67 + 0) / 2)
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4)
 * (there without absolute values in the denominator); the absolute-value form
 * is the one used in the M4 competition.
 */
export function smape(actual: readonly number[], forecast: readonly number[]): number {
  const [a, f] = validRows('sMAPE', ['actual', 'forecast'], [actual, forecast]);
  let sum = 0;
  for (let i = 0; i < a.length; i++) {
    let scale = Math.abs(a[i]) + Math.abs(f[i]);
    let diff = Math.abs(f[i] - a[i]);
    // near 1e308 these overflow: the halves give the same ratio
    if (scale === Infinity) { scale = Math.abs(a[i] / 2) + Math.abs(f[i] / 2); diff = Math.abs(f[i] / 2 - a[i] / 2); }
    if (scale > 0) sum += 2 * (diff / scale);
  }
  return (100 * sum) / a.length;
}
