import { InputError } from '../errors';
import { finiteScore } from './finite-score';
import { validRows } from './valid-rows';

/**
 * Relative MAE: MAE of the forecast divided by the MAE of a reference forecast
 * (e.g. the weekly naive one), both over the same periods, those where actual,
 * forecast and reference are all known. Below 1 the forecast beats the
 * reference.
 *
 * @param actual - observed prices
 * @param forecast - forecast prices
 * @param reference - reference forecast prices; all three of the same length
 * @returns the rMAE (unit-free)
 * @throws {InputError} on different lengths, ±Infinity, no complete period, or
 *   a reference with zero error, or sums or a ratio that overflow (finite-score.ts)
 * @example rmae([10, 20], [11, 19], [12, 22]) // 0.5
 * Source: Lago, Marcjasz, De Schutter & Weron (2021), "Forecasting day-ahead
 * electricity prices: a review of state-of-the-art algorithms, best practices
 * and an open-access benchmark", Applied Energy 293, 116983.
 */
export function rmae(
  actual: readonly number[],
  forecast: readonly number[],
  reference: readonly number[],
): number {
  const [a, f, r] = validRows('rMAE', ['actual', 'forecast', 'reference'], [actual, forecast, reference]);
  let forecastSum = 0;
  let referenceSum = 0;
  for (let i = 0; i < a.length; i++) {
    forecastSum += Math.abs(f[i] - a[i]);
    referenceSum += Math.abs(r[i] - a[i]);
  }
  finiteScore('rMAE', forecastSum);
  finiteScore('rMAE', referenceSum);
  if (referenceSum === 0) {
    throw new InputError('rMAE is undefined: the reference forecast has no error on these periods; use MAE');
  }
  return finiteScore('rMAE', forecastSum / referenceSum);
}
