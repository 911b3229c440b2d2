import Papa from 'papaparse';
import { InputError } from '../errors';
import { isMissingMarker } from './missing-markers';
import { isCommaNumber, isPlainNumber, type DecimalMark } from './parse-number';
import { quoteCell } from './quote-cell';

/**
 * The dialects desks export data files in: `,` `;` or tab between cells,
 * `.` or `,` as the decimal mark (a decimal comma only beside a `;` or tab
 * separator). The plain dialect is `,` with `.`.
 *
 * Detection, when the user does not say:
 * - the separator is the one that splits the header row into the most
 *   columns (at least two) and every one of the first rows into as many,
 *   without leaving a quote unbalanced;
 * - the decimal mark is read from the numbers themselves: `41,25`, `0,5`
 *   or `1.234,5` can only be decimal commas, `41.25` or `1,234.5` only
 *   decimal points. A file that shows both is refused; so is one whose only
 *   evidence is a number like `1.234` or `1,234` (a decimal mark or a
 *   thousands separator?), naming the choice.
 *
 * @example detectDelimiter('timestamp;price\n2025-01-01T00:00Z;41,2\n') // ';'
 * Source: RFC 4180 (quoting); ISO 80000-1:2022, 7.3.2 (decimal sign); common practice of spreadsheet exports.
 */
export type Delimiter = ',' | ';' | '\t';

export interface Dialect {
  delimiter: Delimiter;
  decimal: DecimalMark;
}

/** What the user fixed (command line `--delimiter`, `--decimal`); the rest is detected. */
export interface DialectChoice {
  delimiter?: Delimiter;
  decimal?: DecimalMark;
}

const CANDIDATES: Delimiter[] = [',', ';', '\t'];
const SAMPLE_CHARS = 65_536;
const SAMPLE_ROWS = 30;

/** A separator as a user writes it: `,`, `;`, `tab` (or a tab character). */
export function parseDelimiter(text: string): Delimiter {
  const t = text === '\t' ? '\t' : text.trim().toLowerCase();
  if (t === ',' || t === ';') return t;
  if (t === 'tab' || t === '\t' || t === '\\t') return '\t';
  throw new InputError(`${quoteCell(text)} is not a separator Spotloom reads; give , or ; or tab`);
}

/** A decimal mark as a user writes it: `.` or `,`. */
export function parseDecimalMark(text: string): DecimalMark {
  const t = text.trim();
  if (t === '.' || t === ',') return t;
  throw new InputError(`${quoteCell(text)} is not a decimal mark; give . or ,`);
}

/** How the separator reads in a message: `','`, `';'`, `tab`. */
export function delimiterName(d: Delimiter): string {
  return d === '\t' ? 'tab' : `'${d}'`;
}

/** The line for the user when the dialect is not the plain one, e.g. "read as ';'-separated with decimal commas". */
export function describeDialect(d: Dialect): string | undefined {
  if (d.delimiter === ',' && d.decimal === '.') return undefined;
  const sep = d.delimiter === '\t' ? 'tab-separated' : `${delimiterName(d.delimiter)}-separated`;
  return `read as ${sep}${d.decimal === ',' ? ' with decimal commas' : ''}`;
}

/** The separator of a CSV text (see the rule above); `,` when nothing splits the header. */
export function detectDelimiter(text: string): Delimiter {
  let sample = text.length > SAMPLE_CHARS ? text.slice(0, SAMPLE_CHARS) : text;
  if (sample.length < text.length && sample.lastIndexOf('\n') > 0) sample = sample.slice(0, sample.lastIndexOf('\n'));
  let best: { d: Delimiter; score: number[] } | undefined;
  for (const d of CANDIDATES) {
    const parsed = Papa.parse<string[]>(sample, { delimiter: d, preview: SAMPLE_ROWS + 1, skipEmptyLines: 'greedy' });
    const records = parsed.data;
    const width = records[0]?.length ?? 0;
    if (width < 2) continue;
    // a separator that leaves quotes unbalanced (a quoted "x,y" read with the wrong one) is the wrong one
    const clean = parsed.errors.some((e) => e.type === 'Quotes') ? 0 : 1;
    const consistent = records.every((r) => r.length === width) ? 1 : 0;
    const score = [clean, consistent, width];
    if (!best || ahead(score, best.score)) best = { d, score };
  }
  return best?.d ?? ',';
}

/** True when score `a` is ahead of `b`, comparing entry by entry (earlier entries matter more); ties keep the earlier candidate. */
function ahead(a: number[], b: number[]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] > b[i];
  return false;
}

type Evidence = 'comma' | 'point' | 'maybe-point' | 'maybe-comma';

/**
 * What one cell says about the decimal mark, if anything. Only a cell that
 * is a number in one of the notations counts (garbage is refused later, at
 * its row): 12.5 or 0.123 is a decimal point, 12,5 or 1.234,5 a decimal
 * comma, 1.234.567 can only group thousands (so its mark is the comma), and
 * 1.234 or 1,234 could be either.
 */
function evidenceOf(t: string): Evidence | undefined {
  const comma = t.includes(','), point = t.includes('.');
  if (!comma && !point) return undefined;
  if (isPlainNumber(t)) return /^[+-]?[1-9]\d{0,2}\.\d{3}$/.test(t) ? 'maybe-point' : 'point';
  if (isCommaNumber(t)) return /^[+-]?[1-9]\d{0,2},\d{3}$/.test(t) ? 'maybe-comma' : 'comma';
  return undefined;
}

/**
 * The decimal mark of a file's data rows (header and timestamp column
 * excluded), or an InputError naming the cells when the numbers are mixed
 * or ambiguous.
 */
export function detectDecimal(rows: string[][], rowNumbers: number[], header: string[], source: string): DecimalMark {
  const first: Partial<Record<Evidence, { text: string; row: number; column: string }>> = {};
  // the timestamp column holds no numbers of the file's dialect (a stray serial there is refused later)
  const timeColumn = header.findIndex((h) => h.trim().toLowerCase() === 'timestamp');
  for (let i = 0; i < rows.length; i++) {
    const cells = rows[i];
    for (let c = 0; c < cells.length; c++) {
      if (c === timeColumn) continue;
      const t = cells[c].trim();
      if (isMissingMarker(t)) continue;
      const e = evidenceOf(t);
      if (e && !first[e]) first[e] = { text: t, row: rowNumbers[i], column: header[c] ?? `column ${c + 1}` };
    }
    if (first.comma && first.point) break;
  }
  const at = (x: { text: string; row: number; column: string }) => `${quoteCell(x.text)} in row ${x.row}, column "${x.column}"`;
  if (first.comma && first.point) {
    throw new InputError(
      `the numbers mix decimal commas (${at(first.comma)}) and decimal points (${at(first.point)}); write them one way, or say which is meant (spotloom: --decimal , or --decimal .)`,
      { file: source },
    );
  }
  if (first.comma) return ',';
  if (first.point) return '.';
  const point = first['maybe-point'];
  if (point) {
    throw new InputError(
      `${quoteCell(point.text)} could be ${point.text} with a decimal point or ${point.text.replace(/\./g, '')} with "." grouping thousands, and no other number in the file tells which; say which is meant (spotloom: --decimal . or --decimal ,)`,
      { file: source, row: point.row, column: point.column },
    );
  }
  const comma = first['maybe-comma'];
  if (comma) {
    throw new InputError(
      `${quoteCell(comma.text)} could be ${comma.text.replace(',', '.')} with a decimal comma or ${comma.text.replace(/,/g, '')} with "," grouping thousands (which Spotloom does not read), and no other number in the file tells which; for a decimal comma say so (spotloom: --decimal ,), else write the numbers without thousands separators`,
      { file: source, row: comma.row, column: comma.column },
    );
  }
  return '.';
}
