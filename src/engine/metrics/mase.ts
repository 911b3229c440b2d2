import { finiteScore } from './finite-score';
import { mae } from './mae';
import { maseScale } from './mase-scale';

/**
 * Mean absolute scaled error: the MAE of the forecast divided by the in-sample
 * MAE of the seasonal naive forecast (`maseScale(insample, season)`). Below 1
 * the forecast beats the in-sample seasonal naive forecast. Pairs with a NaN
 * are skipped, in both parts.
 *
 * @param actual - observed prices of the evaluation span
 * @param forecast - forecast prices, same length as `actual`
 * @param insample - the series that sets the scale (e.g. the training span)
 * @param season - seasonal period in periods (1 = naive)
 * @returns the MASE (unit-free)
 * @throws {InputError} as `mae` and `maseScale`, and a ratio that overflows
 * @example mase([4, 6], [5, 5], [1, 3, 2, 6], 2) // 0.5 (= MAE 1 / scale 2)
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4).
 */
export function mase(
  actual: readonly number[],
  forecast: readonly number[],
  insample: readonly number[],
  season: number,
): number {
  const scale = maseScale(insample, season);
  return finiteScore('MASE', mae(actual, forecast) / scale);
}
