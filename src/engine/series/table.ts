import Papa from 'papaparse';
import { InputError } from '../errors';
import { delimiterName, detectDecimal, detectDelimiter, type Dialect, type DialectChoice } from './csv-dialect';
import { plural } from './plural';

/**
 * A table as read from a CSV file or a sheet range: a header and rows of
 * cell texts. `rowNumbers[i]` is the 1-based line (or sheet row) of row i,
 * so every message can point the user at the right place. `dialect` says
 * how a file was written: numbers are read with its decimal mark and its
 * missing markers (NA, #N/A, …) as unknown. A table without one (built from
 * sheet ranges) is plain: `.` decimals, only empty cells unknown.
 */
export interface Table {
  source: string;
  header: string[];
  rows: string[][];
  rowNumbers: number[];
  dialect?: Dialect;
}

/**
 * Reads UTF-8 CSV text (BOM allowed; header row; RFC 4180 quoting) in the
 * dialect the file was written in: separator `,` `;` or tab and decimal
 * mark `.` or `,`, each detected unless `choice` fixes it (csv-dialect.ts).
 * This is the one reader of data files: the command line and the preview's
 * CSV import both use it. Blank lines are skipped but keep their place in
 * the row numbering.
 *
 * @throws InputError for an empty file, an unclosed quote, a row with the
 *   wrong number of cells, or numbers whose decimal mark is mixed or ambiguous.
 * @example parseCsv('timestamp,price\n2025-01-01T00:00Z,41.2\n', 'a.csv').rows // [['2025-01-01T00:00Z','41.2']]
 * @example parseCsv('timestamp;price\n2025-01-01T00:00Z;41,2\n', 'b.csv').dialect // { delimiter: ';', decimal: ',' }
 */
export function parseCsv(text: string, source: string, choice: DialectChoice = {}): Table {
  const clean = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (choice.delimiter === ',' && choice.decimal === ',') {
    throw new InputError('a decimal comma needs ; or tab as the separator (a comma cannot be both)', { file: source });
  }
  const delimiter = choice.delimiter ?? detectDelimiter(clean);
  const parsed = Papa.parse<string[]>(clean, { delimiter, skipEmptyLines: false });
  const records = parsed.data;
  // a quoted cell may hold line breaks: count them so row numbers stay file lines
  const lineOf: number[] = [];
  let line = 1;
  for (const cells of records) {
    lineOf.push(line);
    line += 1;
    for (const c of cells) for (let k = c.indexOf('\n'); k >= 0; k = c.indexOf('\n', k + 1)) line++;
  }
  const unclosed = parsed.errors.find((e) => e.code === 'MissingQuotes');
  if (unclosed) {
    throw new InputError('a quoted cell is not closed: a " opens it and no " ends it', { file: source, row: lineOf[unclosed.row ?? 0] ?? 1 });
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
      throw new InputError(
        `has ${plural(cells.length, 'cell')} but the header has ${plural(header.length, 'column')} (the file reads as ${delimiterName(delimiter)}-separated); check this row for a stray ${delimiterName(delimiter)} or an unclosed quote`,
        { file: source, row: lineOf[i] },
      );
    }
    rows.push(cells);
    rowNumbers.push(lineOf[i]);
  }
  const decimal = choice.decimal ?? (delimiter === ',' ? '.' : detectDecimal(rows, rowNumbers, header, source));
  return { source, header, rows, rowNumbers, dialect: { delimiter, decimal } };
}

function isBlank(cells: string[]): boolean {
  return cells.every((c) => c.trim() === '');
}
