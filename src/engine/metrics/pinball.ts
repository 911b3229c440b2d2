import { InputError } from '../errors';
import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

/**
 * Mean pinball (quantile) loss of a forecast of the tau-quantile:
 * mean of max(tau (A - Q), (tau - 1) (A - Q)) over the periods where both are
 * known (pairs with a NaN are skipped). At tau = 0.5 it is half the MAE.
 *
 * @param actual - observed prices
 * @param quantileForecast - forecast tau-quantiles, same length as `actual`
 * @param tau - quantile level, strictly between 0 and 1
 * @returns the mean pinball loss, in the unit of the prices
 * @throws {InputError} on tau outside (0, 1), different lengths, ±Infinity,
 *   no complete pair, or a result that overflows (finite-score.ts)
 * @example pinball([10, 10], [8, 13], 0.9) // 1.05 (= (0.9*2 + 0.1*3) / 2)
 * Source: Koenker & Bassett (1978), "Regression quantiles", Econometrica
 * 46(1); Gneiting & Raftery (2007), JASA 102(477).
 */
export function pinball(
  actual: readonly number[],
  quantileForecast: readonly number[],
  tau: number,
): number {
  if (!(tau > 0 && tau < 1)) {
    throw new InputError(`pinball loss requires tau strictly between 0 and 1 (got ${tau})`);
  }
  const [a, q] = validRows('pinball loss', ['actual', 'forecast'], [actual, quantileForecast]);
  let sum = 0;
  for (let i = 0; i < a.length; i++) {
    const u = a[i] - q[i];
    sum += u >= 0 ? tau * u : (tau - 1) * u;
  }
  return finiteScore('pinball loss', sum / a.length);
}
