import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

/**
 * Mean absolute error, mean of |F - A| over the periods where both values are
 * known (pairs with a NaN are skipped).
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @returns the MAE, in the unit of the prices (currency/MWh)
 * @throws {InputError} on different lengths, ±Infinity, no complete pair, or a
 *   result that overflows (finite-score.ts)
 * @example mae([10, 20, NaN], [12, 17, 5]) // 2.5
 * Source: Hyndman & Koehler (2006), "Another look at measures of forecast
 * accuracy", Int. J. Forecasting 22(4).
 */
export function mae(actual: readonly number[], forecast: readonly number[]): number {
  const [a, f] = validRows('MAE', ['actual', 'forecast'], [actual, forecast]);
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += Math.abs(f[i] - a[i]);
  return finiteScore('MAE', sum / a.length);
}
