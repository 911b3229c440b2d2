import { InputError } from '../errors';

export type LossKind = 'abs' | 'squared';

export interface DailyLossDifferential {
  /** Day indices that had at least one complete period, ascending. */
  days: number[];
  /** Per day: mean loss of A minus mean loss of B over that day's complete periods. */
  diff: number[];
}

/**
 * Loss differential with one value per delivery day, as is usual for
 * day-ahead prices, where the periods of one day are forecast together: for
 * each day, the mean loss of forecast A minus the mean loss of forecast B over
 * that day's periods. A period is used only when actual, A and B are all known
 * (not NaN); a day with no such period is dropped.
 *
 * @param actual - observed prices
 * @param a - forecast A
 * @param b - forecast B
 * @param dayOf - delivery-day index of each period (any whole numbers; equal = same day)
 * @param loss - `'abs'` (|F - A|, daily MAE) or `'squared'` ((F - A)^2, daily MSE)
 * @returns `{ days, diff }`, sorted by day
 * @throws {InputError} on different lengths, ±Infinity, a day index that is
 *   not a whole number, an unknown loss, no complete period, or losses that
 *   overflow
 * @example dailyLossDifferential([1, 2, 3], [1, 3, 3], [2, 2, 2], [0, 0, 1], 'abs').diff // [0, -1]
 * Source: Lago, Marcjasz, De Schutter & Weron (2021), "Forecasting day-ahead
 * electricity prices: a review of state-of-the-art algorithms, best practices
 * and an open-access benchmark", Applied Energy 293, 116983 (DM test on daily
 * loss differentials).
 */
export function dailyLossDifferential(
  actual: readonly number[],
  a: readonly number[],
  b: readonly number[],
  dayOf: readonly number[],
  loss: LossKind,
): DailyLossDifferential {
  if (loss !== 'abs' && loss !== 'squared') {
    throw new InputError(`unknown loss "${String(loss)}"; use "abs" or "squared"`);
  }
  const n = actual.length;
  if (a.length !== n || b.length !== n || dayOf.length !== n) {
    throw new InputError(
      `forecast comparison requires actual, forecast A, forecast B and day index of the same length (got ${n}, ${a.length}, ${b.length} and ${dayOf.length})`,
    );
  }
  const lossOf = loss === 'abs' ? Math.abs : (e: number) => e * e;
  const sums = new Map<number, { sum: number; count: number }>();
  for (let i = 0; i < n; i++) {
    if (!Number.isInteger(dayOf[i])) {
      throw new InputError(`forecast comparison: day index ${i + 1} is ${dayOf[i]}; give a whole number`);
    }
    const values = [actual[i], a[i], b[i]];
    if (values.some((v) => !Number.isNaN(v) && !Number.isFinite(v))) {
      throw new InputError(`forecast comparison: period ${i + 1} has an infinite value; give finite numbers, or NaN for unknown`);
    }
    if (values.some(Number.isNaN)) continue;
    const day = sums.get(dayOf[i]) ?? { sum: 0, count: 0 };
    day.sum += lossOf(a[i] - actual[i]) - lossOf(b[i] - actual[i]);
    day.count++;
    sums.set(dayOf[i], day);
  }
  if (sums.size === 0) {
    throw new InputError('forecast comparison requires at least 1 period where actual, forecast A and forecast B are all known');
  }
  for (const [day, { sum }] of sums) {
    if (!Number.isFinite(sum)) {
      throw new InputError(`forecast comparison: the losses of day ${day} are too large to compute (beyond ±1.8e308); check the units of the values`);
    }
  }
  const days = [...sums.keys()].sort((x, y) => x - y);
  return { days, diff: days.map((day) => sums.get(day)!.sum / sums.get(day)!.count) };
}
