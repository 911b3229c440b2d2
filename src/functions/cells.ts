import { InputError, parseNumber, type Where } from '../engine';

/**
 * Cell values as the host passes them to a cell function: a range argument
 * is rows × columns of numbers, strings and booleans; an empty cell is `''`
 * or `null`, an omitted optional argument `null`. The one rule here: an
 * empty cell is unknown (NaN), never zero. That is why every range
 * parameter is declared `any[][]`: a `number[][]` parameter would let the
 * host turn empty cells into 0 before we see them.
 */

/** True for an empty cell or an omitted argument. */
export function isBlank(v: unknown): boolean {
  return v === null || v === undefined || (typeof v === 'string' && v.trim() === '');
}

/** True for an omitted optional range argument (also a single empty cell). */
export function isOmitted(v: unknown): boolean {
  if (isBlank(v)) return true;
  return Array.isArray(v) && v.length === 1 && Array.isArray(v[0]) && v[0].length === 1 && isBlank(v[0][0]);
}

/**
 * A range argument as one list of cells, in order: a column, a row or a
 * single value. A block with several rows and columns is refused.
 *
 * @example cellList([[1], [2], ['']], 'prices') // [1, 2, '']
 */
export function cellList(range: unknown, what: string): unknown[] {
  if (!Array.isArray(range)) return [range];
  const rows = range as unknown[];
  if (rows.length === 0) return [];
  if (!rows.every(Array.isArray)) return rows; // already one list
  const grid = rows as unknown[][];
  if (grid.length === 1) return [...grid[0]];
  if (grid.every((row) => row.length === 1)) return grid.map((row) => row[0]);
  throw new InputError(`${what} must be one column (or one row) of cells; it has ${grid.length} rows and ${grid[0].length} columns`);
}

/** A range argument as rows × columns (a single value becomes 1 × 1). */
export function cellGrid(range: unknown): unknown[][] {
  if (!Array.isArray(range)) return [[range]];
  if (range.length > 0 && !range.every(Array.isArray)) return range.map((v) => [v]);
  return range as unknown[][];
}

/**
 * A cell as a number: a number is itself, an empty cell is NaN (unknown),
 * numeric text is read with `.` as decimal separator; anything else
 * (other text, TRUE/FALSE, an error value) is refused.
 *
 * @example cellNumber('', { column: 'prices', row: 3 }) // NaN
 */
export function cellNumber(v: unknown, where: Where): number {
  if (isBlank(v)) return NaN;
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) throw new InputError(`${v} is not a finite number`, where);
    return v;
  }
  if (typeof v === 'string') return parseNumber(v, where);
  if (typeof v === 'boolean') throw new InputError(`${v ? 'TRUE' : 'FALSE'} is not a number`, where);
  throw new InputError('holds an error or a value that is not a number', where);
}

/** The cell's number in the text form the engine's table reader takes ('' for unknown). */
export function numberText(v: unknown, where: Where): string {
  const n = cellNumber(v, where);
  return Number.isNaN(n) ? '' : String(n);
}

/** An optional text argument, trimmed; `fallback` when omitted. */
export function textArg(v: unknown, name: string, fallback: string): string {
  const cell = Array.isArray(v) ? cellList(v, name)[0] : v;
  if (isBlank(cell)) return fallback;
  if (typeof cell !== 'string') throw new InputError(`${name} must be text, e.g. "${fallback}"; got ${String(cell)}`);
  return cell.trim();
}

/** An optional number argument; `fallback` when omitted. */
export function numberArg(v: unknown, name: string, fallback: number): number {
  const cell = Array.isArray(v) ? cellList(v, name)[0] : v;
  if (isBlank(cell)) return fallback;
  const n = cellNumber(cell, { column: name });
  return n;
}
