import { InputError } from '../errors';
import { finiteScore } from './finite-score';

/**
 * The MASE scale: the in-sample mean absolute error of the seasonal naive
 * forecast, mean |y_t - y_(t-season)| over t = season+1..n, skipping pairs in
 * which either value is NaN.
 *
 * @param series - in-sample prices, oldest first, evenly spaced
 * @param season - seasonal period in periods (1 = naive; 24 = one day of hours)
 * @returns the scale, in the unit of the prices
 * @throws {InputError} on a season that is not a whole number >= 1, ±Infinity,
 *   no complete pair `season` apart, a scale of 0, or one that overflows
 * @example maseScale([1, 3, 2, 6], 2) // 2 (= (|2-1| + |6-3|) / 2)
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4),
 * seasonal form as in R forecast::accuracy().
 */
export function maseScale(series: readonly number[], season: number): number {
  if (!(Number.isInteger(season) && season >= 1)) {
    throw new InputError(`MASE season must be a whole number of periods of at least 1 (got ${season})`);
  }
  let sum = 0;
  let count = 0;
  for (let t = 0; t < series.length; t++) {
    const value = series[t];
    if (!Number.isNaN(value) && !Number.isFinite(value)) {
      throw new InputError(`MASE: in-sample value ${t + 1} is ${value}; give a finite number, or NaN for unknown`);
    }
    if (t < season || Number.isNaN(value) || Number.isNaN(series[t - season])) continue;
    sum += Math.abs(value - series[t - season]);
    count++;
  }
  if (count === 0) {
    throw new InputError(
      `MASE scale requires at least 1 pair of in-sample values ${season} periods apart (got ${series.length} values)`,
    );
  }
  if (sum === 0) {
    throw new InputError(
      `MASE is undefined: the in-sample series repeats exactly every ${season} periods, so the scale is 0; use MAE or rMAE`,
    );
  }
  return finiteScore('MASE scale', sum / count);
}
