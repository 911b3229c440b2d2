import { describeDialect, InputError, isMissingMarker, parseCsv, parseNumber, plural } from '../engine';
import { formatA1, MAX_COLUMNS, MAX_ROWS } from '../host/a1';
import type { CellValue } from '../host/workbook-port';

/**
 * A CSV file (the design's data file: UTF-8, header row, `,` `;` or tab
 * separator, `.` or `,` decimal) as a new sheet of the preview workbook,
 * read by the engine's one data-file reader (parseCsv), so the preview reads
 * every file exactly as the command line does.
 *
 * - numeric text becomes a number (in the file's decimal mark), an empty
 *   field or a missing marker (NA, #N/A, …) an empty cell, anything else
 *   (timestamps, names) stays text;
 * - a field that begins with `=` is kept as text with a leading apostrophe,
 *   so a file can never put a formula into the workbook;
 * - the sheet is named after the file (characters a sheet name may not hold
 *   become `_`, at most 31 characters, a number added when the name is taken);
 * - the ranges the Data section needs are suggested from the header: the
 *   `timestamp` and `price` columns (else the first two), every other column
 *   a driver.
 *
 * @throws InputError for an empty file, one too large for a sheet, or one the data-file reader refuses (unclosed quote, ragged row, ambiguous decimals)
 * @example csvSheet('timestamp,price\n2025-01-01T00:00Z,41.5\n', 'prices.csv', []).ranges.prices // 'prices!B1:B2'
 */
export interface CsvSheet {
  name: string;
  grid: CellValue[][];
  ranges: { times: string; prices: string; drivers: string[] };
  rows: number;
  notes: string[];
}

/** the most cells the preview takes from one file (a browser tab's memory, not the sheet, is the limit) */
export const MAX_IMPORT_CELLS = 3_000_000;
// text that may be a number in some dialect (parseNumber decides)
const NUMBER_LOOKING = /^[+-]?[\d.,]*\d[\d.,]*([eE][+-]?\d+)?$/;

export function csvSheet(text: string, fileName: string, taken: string[]): CsvSheet {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text; // a byte-order mark is not part of the header
  if (body.trim() === '') throw new InputError(`${fileName} is empty; a data file has a header row and one row per delivery period`);
  const table = parseCsv(body, fileName);
  const decimal = table.dialect?.decimal ?? '.';
  const lines = [table.header, ...table.rows];
  const width = table.header.length;
  if (lines.length > MAX_ROWS || width > MAX_COLUMNS || lines.length * width > MAX_IMPORT_CELLS) {
    throw new InputError(`${fileName} has ${lines.length} rows and ${width} columns, more than the preview takes (${MAX_IMPORT_CELLS.toLocaleString('en')} cells); cut it to the recent years`);
  }
  let guarded = 0, marked = 0;
  const grid = lines.map((line, r) => line.map((raw): CellValue => {
    const field = raw.trim();
    if (field === '') return null;
    if (r > 0 && isMissingMarker(field)) { marked++; return null; }
    if (NUMBER_LOOKING.test(field)) {
      try {
        return parseNumber(field, undefined, decimal);
      } catch {
        return field;
      }
    }
    if (field.startsWith('=')) { guarded++; return `'${field}`; }
    return field;
  }));

  const name = sheetNameFor(fileName, taken);
  const header = grid[0].map((v) => (typeof v === 'string' ? v.trim().toLowerCase() : ''));
  const titled = grid[0].some((v) => typeof v === 'string' && !/^\d{4}-\d{2}-\d{2}/.test(v));
  const find = (label: string, fallback: number) => { const k = titled ? header.indexOf(label) : -1; return k >= 0 ? k : fallback; };
  const t = find('timestamp', 0);
  const p = find('price', t === 1 ? 0 : 1);
  const n = grid.length;
  const column = (c: number, to = c) => formatA1({ sheet: name, row: 0, column: c, rows: n, columns: to - c + 1 });
  const others = Array.from({ length: width }, (_, c) => c).filter((c) => c !== t && c !== p);
  const runs: [number, number][] = [];
  for (const c of others) {
    const last = runs[runs.length - 1];
    if (last && last[1] === c - 1) last[1] = c; else runs.push([c, c]);
  }
  const notes = [`${plural(n - (titled ? 1 : 0), 'data row')}, ${plural(width, 'column')}`];
  const dialect = table.dialect && describeDialect(table.dialect);
  if (dialect) notes.push(dialect);
  if (marked) notes.push(`${plural(marked, 'cell')} with a missing marker (NA, #N/A, -, …) left empty`);
  if (width < 2) notes.push('a data file needs at least a timestamp and a price column');
  if (!titled) notes.push('no header row found: the first column is taken as timestamps, the second as prices');
  if (guarded) notes.push(`${guarded} field${guarded === 1 ? '' : 's'} beginning with = kept as text (shown with a leading ')`);
  return {
    name,
    grid,
    ranges: { times: column(t), prices: column(Math.min(p, width - 1)), drivers: runs.map(([a, b]) => column(a, b)) },
    rows: n,
    notes,
  };
}

/** A sheet name from a file name that no sheet in `taken` has (names compared without regard to case). */
export function sheetNameFor(fileName: string, taken: string[]): string {
  const base = fileName.replace(/^.*[\\/]/, '').replace(/\.(csv|txt)$/i, '').replace(/[:\\/?*[\]]/g, '_').replace(/^'+|'+$/g, '').trim().slice(0, 31) || 'Imported';
  const used = new Set(taken.map((t) => t.toLowerCase()));
  if (!used.has(base.toLowerCase())) return base;
  for (let k = 2; ; k++) {
    const suffix = ` ${k}`;
    const candidate = `${base.slice(0, 31 - suffix.length)}${suffix}`;
    if (!used.has(candidate.toLowerCase())) return candidate;
  }
}
