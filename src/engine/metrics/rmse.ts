import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

/**
 * Root mean squared error, sqrt(mean((F - A)^2)) over the periods where both
 * values are known (pairs with a NaN are skipped).
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @returns the RMSE, in the unit of the prices
 * @throws {InputError} on different lengths, ±Infinity, no complete pair, or a
 *   result that overflows (finite-score.ts)
 * @example rmse([0, 0], [3, -4]) // 3.5355... (sqrt(12.5))
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4).
 */
export function rmse(actual: readonly number[], forecast: readonly number[]): number {
  const [a, f] = validRows('RMSE', ['actual', 'forecast'], [actual, forecast]);
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += (f[i] - a[i]) ** 2;
  return finiteScore('RMSE', Math.sqrt(sum / a.length));
}
