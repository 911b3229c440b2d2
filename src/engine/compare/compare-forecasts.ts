import { InputError } from '../errors';
import { dailyLossDifferential, type LossKind } from './daily-loss-differential';
import { dieboldMariano } from './diebold-mariano';

export interface ForecastComparison {
  /** HLN-corrected Diebold–Mariano statistic on the daily loss differential. */
  statistic: number;
  /** One-sided p-value for H1 "A is more accurate than B". */
  pValue: number;
  /** Number of delivery days used. */
  days: number;
}

/**
 * Compares two forecasts of the same prices the way the day-ahead literature
 * does: one loss difference per delivery day (`dailyLossDifferential`), then
 * the Diebold–Mariano test with the HLN correction, h = 1, one-sided for
 * "A is more accurate than B". This is LOOM.COMPARE and `score --against`.
 *
 * @param actual - observed prices
 * @param a - forecast A (the one claimed better)
 * @param b - forecast B
 * @param dayOf - delivery-day index of each period
 * @param loss - `'abs'` (default) or `'squared'`
 * @returns `{ statistic, pValue, days }`
 * @throws {InputError} as `dailyLossDifferential`, and fewer than 2 days with data
 * @example compareForecasts([10, 20, 10, 20, 10, 20], [11, 20, 10, 21, 12, 20], [13, 18, 14, 20, 10, 25], [0, 0, 1, 1, 2, 2])
 *   // { statistic: -10, pValue: 0.0049, days: 3 }: A is better
 * Source: Lago, Marcjasz, De Schutter & Weron (2021), Applied Energy 293,
 * 116983; Harvey, Leybourne & Newbold (1997), Int. J. Forecasting 13(2).
 */
export function compareForecasts(
  actual: readonly number[],
  a: readonly number[],
  b: readonly number[],
  dayOf: readonly number[],
  loss: LossKind = 'abs',
): ForecastComparison {
  const { diff } = dailyLossDifferential(actual, a, b, dayOf, loss);
  if (diff.length < 2) {
    throw new InputError(`forecast comparison requires at least 2 delivery days with data (got ${diff.length})`);
  }
  const { statistic, pValue, n } = dieboldMariano(diff, { h: 1 });
  return { statistic, pValue, days: n };
}
