import { InputError } from '../errors';

/**
 * The last check of a metric: a score computed from finite inputs must be
 * finite itself. Values near the ends of the double range (about ±1.8e308)
 * can overflow in a difference, a square or a sum, and a ratio can overflow
 * when its denominator is tiny; then the metric says so instead of
 * returning Infinity, NaN or a ratio with an infinite part (0).
 *
 * @param metric - name used in the message, e.g. `"RMSE"`
 * @param value - the score, or a part of it such as a sum
 * @returns `value` when it is finite
 * @throws {InputError} when `value` is ±Infinity or NaN
 * @example finiteScore('MAE', 2.5) // 2.5
 * Source: common practice (IEEE 754 arithmetic overflows to ±Infinity).
 */
export function finiteScore(metric: string, value: number): number {
  if (!Number.isFinite(value)) {
    throw new InputError(`${metric} is too large to compute (beyond ±1.8e308): the values are extreme; check their units`);
  }
  return value;
}
