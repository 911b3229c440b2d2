import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

/**
 * Bias, the mean of (F - A) over the periods where both values are known
 * (pairs with a NaN are skipped). Sign convention: positive means the forecast
 * was too high on average, negative too low. (R's forecast::accuracy() reports
 * ME = mean(A - F), the same number with the opposite sign.)
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @returns the mean forecast error F - A, in the unit of the prices
 * @throws {InputError} on different lengths, ±Infinity, no complete pair, or a
 *   result that overflows (finite-score.ts)
 * @example bias([10, 20], [12, 21]) // 1.5 (forecast 1.5 too high)
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4) (ME, sign flipped).
 */
export function bias(actual: readonly number[], forecast: readonly number[]): number {
  const [a, f] = validRows('bias', ['actual', 'forecast'], [actual, forecast]);
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += f[i] - a[i];
  return finiteScore('bias', sum / a.length);
}
