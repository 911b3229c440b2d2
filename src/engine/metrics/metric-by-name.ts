import { InputError } from '../errors';
import { bias } from './bias';
import { mae } from './mae';
import { mape } from './mape';
import { mase } from './mase';
import { pinball } from './pinball';
import { rmae } from './rmae';
import { rmse } from './rmse';
import { smape } from './smape';

/** The metric names LOOM.SCORE accepts, in the order they are listed to users. */
export const METRIC_NAMES = ['MAE', 'RMSE', 'SMAPE', 'MAPE', 'MASE', 'RMAE', 'BIAS', 'PINBALL'] as const;
export type MetricName = (typeof METRIC_NAMES)[number];

export interface MetricOptions {
  /** MASE: seasonal period in periods (required for MASE). */
  season?: number;
  /** MASE: series that sets the scale (default: `actual` itself). */
  insample?: readonly number[];
  /** RMAE: reference forecast (required for RMAE). */
  reference?: readonly number[];
  /** PINBALL: quantile level in (0, 1) (required for PINBALL). */
  tau?: number;
  /** MAPE: guard, pairs with |actual| below this are left out (default 1). */
  minAbsActual?: number;
}

/**
 * One error score chosen by name, for LOOM.SCORE. The name is case-insensitive
 * (`"mae"`, `"sMAPE"`, `"Pinball"` all work). Each metric skips pairs with a
 * NaN as documented in its own file.
 *
 * @param name - one of MAE, RMSE, SMAPE, MAPE, MASE, RMAE, BIAS, PINBALL
 * @param actual - observed prices
 * @param forecast - forecast prices (for PINBALL: the tau-quantile forecast)
 * @param options - what the metric needs: `season` (MASE), `reference` (RMAE), `tau` (PINBALL)
 * @returns the score
 * @throws {InputError} for an unknown name (listing the valid ones), a missing
 *   option, or whatever the metric itself refuses
 * @example metricByName('rmse', [0, 0], [3, -4]) // 3.5355...
 * Source: the definitions cited in each metric's file.
 */
export function metricByName(
  name: string,
  actual: readonly number[],
  forecast: readonly number[],
  options: MetricOptions = {},
): number {
  const key = String(name).trim().toUpperCase();
  switch (key as MetricName) {
    case 'MAE':
      return mae(actual, forecast);
    case 'RMSE':
      return rmse(actual, forecast);
    case 'SMAPE':
      return smape(actual, forecast);
    case 'MAPE':
      return mape(actual, forecast, { minAbsActual: options.minAbsActual });
    case 'MASE':
      if (options.season === undefined) {
        throw new InputError('MASE needs a season: the number of periods in one seasonal cycle (e.g. 24 for hourly prices)');
      }
      return mase(actual, forecast, options.insample ?? actual, options.season);
    case 'RMAE':
      if (options.reference === undefined) {
        throw new InputError('RMAE needs a reference forecast to compare with (e.g. the weekly naive forecast)');
      }
      return rmae(actual, forecast, options.reference);
    case 'BIAS':
      return bias(actual, forecast);
    case 'PINBALL':
      if (options.tau === undefined) {
        throw new InputError('PINBALL needs tau, the quantile level of the forecast, between 0 and 1');
      }
      return pinball(actual, forecast, options.tau);
    default:
      throw new InputError(`unknown metric "${name}"; use one of ${METRIC_NAMES.join(', ')}`);
  }
}
