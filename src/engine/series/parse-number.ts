import { InputError, type Where } from '../errors';
import { quoteCell } from './quote-cell';

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * A cell's number: plain decimal with `.` as separator, optional exponent.
 * An empty cell is unknown (NaN). Anything else, including "NaN" and
 * "Infinity", is refused so that no number is ever computed from garbage.
 *
 * @example parseNumber('-12.5') // -12.5
 */
export function parseNumber(text: string, where?: Where): number {
  const t = text.trim();
  if (t === '') return NaN;
  if (!NUMBER.test(t)) throw new InputError(`${quoteCell(t)} is not a number (use . as decimal separator)`, where);
  const value = Number(t);
  if (!Number.isFinite(value)) throw new InputError(`${quoteCell(t)} is too large for a number (beyond ±1.8e308)`, where);
  return value;
}
