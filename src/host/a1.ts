import { InputError } from '../engine';
/**
 * A1 addresses: `A1`, `B2:D40`, `History!A2:C900`, `'Price history'!A:A` is
 * not supported (whole columns need a size). Columns are letters A..XFD
 * (ECMA-376 Part 1, §18.3.1.4: 16 384 columns, 1 048 576 rows).
 */
export interface A1Range {
  sheet?: string;
  row: number; // 0-based top row
  column: number; // 0-based left column
  rows: number;
  columns: number;
}

const CELL = /^\$?([A-Za-z]{1,3})\$?(\d{1,7})$/;
export const MAX_ROWS = 1_048_576;
export const MAX_COLUMNS = 16_384;

export function parseA1(address: string): A1Range {
  const text = address.trim();
  const bang = text.lastIndexOf('!');
  let sheet: string | undefined;
  let cells = text;
  if (bang >= 0) {
    sheet = text.slice(0, bang).replace(/^'(.*)'$/, (_, s: string) => s.replace(/''/g, "'"));
    cells = text.slice(bang + 1);
  }
  const [a, b = a] = cells.split(':');
  const p = cell(a, address), q = cell(b, address);
  const row = Math.min(p.row, q.row), column = Math.min(p.column, q.column);
  return { sheet, row, column, rows: Math.abs(p.row - q.row) + 1, columns: Math.abs(p.column - q.column) + 1 };
}

export function formatA1(r: A1Range): string {
  const start = `${columnName(r.column)}${r.row + 1}`;
  const end = `${columnName(r.column + r.columns - 1)}${r.row + r.rows}`;
  const cells = r.rows === 1 && r.columns === 1 ? start : `${start}:${end}`;
  if (!r.sheet) return cells;
  return /^[A-Za-z0-9_]+$/.test(r.sheet) ? `${r.sheet}!${cells}` : `'${r.sheet.replace(/'/g, "''")}'!${cells}`;
}

export function rangeSize(address: string): { rows: number; columns: number } {
  const r = parseA1(address);
  return { rows: r.rows, columns: r.columns };
}

/** The range of `rows` × `columns` cells whose top-left cell is that of `address`. */
export function resizeAddress(address: string, rows: number, columns: number): string {
  const r = parseA1(address);
  return formatA1({ ...r, rows: Math.max(1, rows), columns: Math.max(1, columns) });
}

export function columnName(index: number): string {
  let n = index + 1, s = '';
  while (n > 0) { const m = (n - 1) % 26; s = String.fromCharCode(65 + m) + s; n = Math.floor((n - 1) / 26); }
  return s;
}

function cell(text: string, address: string): { row: number; column: number } {
  const m = CELL.exec(text.trim());
  if (!m) throw new InputError(`"${address}" is not an A1 address such as History!A2:C900`);
  let column = 0;
  for (const ch of m[1].toUpperCase()) column = column * 26 + (ch.charCodeAt(0) - 64);
  const row = Number(m[2]);
  if (row < 1 || row > MAX_ROWS || column > MAX_COLUMNS) throw new InputError(`"${address}" is outside the sheet`);
  return { row: row - 1, column: column - 1 };
}
