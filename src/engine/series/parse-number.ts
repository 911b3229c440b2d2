import { InputError, type Where } from '../errors';
import { quoteCell } from './quote-cell';

/** The decimal mark of a data file: `.` (plain) or `,` (continental exports). */
export type DecimalMark = '.' | ',';

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// decimal comma; `.` may group thousands in threes (1.234,5), never as a decimal point
const COMMA_NUMBER = /^[+-]?(\d+|[1-9]\d{0,2}(\.\d{3})+)?(,\d*)?([eE][+-]?\d+)?$/;

/**
 * A cell's number: plain decimal with `decimal` as separator, optional
 * exponent. With the decimal comma, `.` may group thousands (`1.234,5` is
 * 1234.5, `6.012` is 6012); a `.` anywhere else is refused, so a number is
 * never read in a dialect it was not written in. An empty cell is unknown
 * (NaN). Anything else, including "NaN" and "Infinity", is refused so that
 * no number is ever computed from garbage (data files read their missing
 * markers first: missing-markers.ts).
 *
 * @example parseNumber('-12.5') // -12.5
 * @example parseNumber('1.234,5', undefined, ',') // 1234.5
 * Source: ISO 80000-1:2022, 7.3.2 (comma or point as decimal sign; digits grouped in threes), common practice of spreadsheet exports.
 */
export function parseNumber(text: string, where?: Where, decimal: DecimalMark = '.'): number {
  const t = text.trim();
  if (t === '') return NaN;
  const plain = decimal === ',' ? commaToPlain(t) : t;
  if (plain === undefined || !NUMBER.test(plain)) {
    throw new InputError(
      decimal === ','
        ? `${quoteCell(t)} is not a number with a decimal comma (write it like 41,25 or 1.234,5)`
        : `${quoteCell(t)} is not a number (use . as decimal separator)`,
      where,
    );
  }
  const value = Number(plain);
  if (!Number.isFinite(value)) throw new InputError(`${quoteCell(t)} is too large for a number (beyond ±1.8e308)`, where);
  return value;
}

/** True when trimmed text `t` is a number in the plain notation (`.` decimal). */
export function isPlainNumber(t: string): boolean {
  return NUMBER.test(t);
}

/** True when trimmed text `t` is a number in the decimal-comma notation (`.` grouping thousands). */
export function isCommaNumber(t: string): boolean {
  const plain = commaToPlain(t);
  return plain !== undefined && NUMBER.test(plain);
}

function commaToPlain(t: string): string | undefined {
  if (!COMMA_NUMBER.test(t)) return undefined;
  return t.replace(/\./g, '').replace(',', '.');
}
