import { mapeGuarded, type MapeOptions } from './mape-guarded';

/**
 * Mean absolute percentage error in percent, 100 * mean(|F - A| / |A|), over
 * the complete pairs with |A| >= minAbsActual (default 1). It is
 * `mapeGuarded(...).value`; use `mapeGuarded` to learn how many pairs the guard
 * left out.
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @param options - `minAbsActual`, a positive number (default 1)
 * @returns the MAPE in percent
 * @throws {InputError} as `mapeGuarded`
 * @example mape([100, 0.2, -50], [90, 5, -40]) // 15
 * Source: Hyndman & Koehler (2006), Int. J. Forecasting 22(4).
 */
export function mape(
  actual: readonly number[],
  forecast: readonly number[],
  options: MapeOptions = {},
): number {
  return mapeGuarded(actual, forecast, options).value;
}
