import Papa from 'papaparse';
import { InputError } from '../errors';

/**
 * A table as read from a CSV file or a sheet range: a header and rows of
 * cell texts. `rowNumbers[i]` is the 1-based line (or sheet row) of row i,
 * so every message can point the user at the right place.
 */
export interface Table {
  source: string;
  header: string[];
  rows: string[][];
  rowNumbers: number[];
}

/**
 * Reads UTF-8 CSV text (header row, comma separator, `.` decimal; RFC 4180 quoting).
 * Blank lines are skipped but keep their place in the row numbering.
 *
 * @throws InputError for an empty file or a row with the wrong number of cells.
 * @example parseCsv('timestamp,price\n2025-01-01T00:00Z,41.2\n', 'a.csv').rows // [['2025-01-01T00:00Z','41.2']]
 */
export function parseCsv(text: string, source: string): Table {
  const clean = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const parsed = Papa.parse<string[]>(clean, { delimiter: ',', skipEmptyLines: false });
  const records = parsed.data;
  // a quoted cell may hold line breaks: count them so row numbers stay file lines
  const lineOf: number[] = [];
  let line = 1;
  for (const cells of records) {
    lineOf.push(line);
    line += 1;
    for (const c of cells) for (let k = c.indexOf('\n'); k >= 0; k = c.indexOf('\n', k + 1)) line++;
  }
  const first = records.findIndex((cells) => !isBlank(cells));
  if (first < 0) throw new InputError('the file is empty; it needs a header row and data rows', { file: source });
  const header = records[first].map((h) => h.trim());
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  for (let i = first + 1; i < records.length; i++) {
    const cells = records[i];
    if (isBlank(cells)) continue;
    if (cells.length !== header.length) {
      throw new InputError(`has ${cells.length} cells but the header has ${header.length}`, { file: source, row: lineOf[i] });
    }
    rows.push(cells);
    rowNumbers.push(lineOf[i]);
  }
  return { source, header, rows, rowNumbers };
}

function isBlank(cells: string[]): boolean {
  return cells.every((c) => c.trim() === '');
}
