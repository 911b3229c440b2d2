import { formatTimestamp, InputError, parseTimestamp } from '../../engine';
import { columnName, MAX_ROWS } from '../../host/a1';
import { writeWithConsent } from '../../host/safe-write';
import type { CellValue, NumberFormat, WorkbookPort } from '../../host/workbook-port';
import { PRICE_FORMAT } from './number-formats';
import { cellNumber, type ForecastRow } from './place-layout';

/**
 * The issued-forecast archive: one sheet, one row per issued period, only
 * ever appended to. Live LOOM cells recompute when new prices arrive; the
 * archive keeps what the desk actually issued, so it can be graded later.
 * Its times stay text with the market's UTC offset (ISO 8601): a record
 * must name each instant exactly, and a wall-clock date-time cell cannot
 * tell the two 02:00 of an autumn night apart. Prices carry two decimals.
 */
export const ARCHIVE_SHEET = 'Forecast archive';
export const ARCHIVE_HEADER = ['issued at', 'model', 'model created', 'model version', 'delivery start', 'forecast', 'lower', 'upper'];
const WIDTH = ARCHIVE_HEADER.length;
const CHUNK = 2000;

/** Who issued what: the facts written beside every archived period. */
export interface Issue {
  /** UTC ms of the issue */
  issuedAt: number;
  model: string;
  /** the model's createdAt */
  created: string;
  /** format version and fingerprint of the stored model (modelVersion) */
  version: string;
  zone: string;
}

export interface ArchiveEntry {
  /** 1-based sheet row */
  row: number;
  issuedAt: number;
  model: string;
  created: string;
  version: string;
  time: number;
  forecast: number;
  lower: number;
  upper: number;
}

/**
 * A short fingerprint of a stored model text (32-bit FNV-1a, hex), with the
 * format version: `1-9c3e01af`. The same text always gives the same tag, a
 * retrained model a different one.
 * Source: Fowler–Noll–Vo hash, FNV-1a variant (IETF draft-eastlake-fnv).
 */
export function modelVersion(formatVersion: number, text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return `${formatVersion}-${h.toString(16).padStart(8, '0')}`;
}

/** The rows one issue appends: one per forecast period. */
export function archiveRows(issue: Issue, rows: ForecastRow[]): CellValue[][] {
  const issued = formatTimestamp(issue.issuedAt, issue.zone);
  return rows.map((r) => [issued, issue.model, issue.created, issue.version, formatTimestamp(r.time, issue.zone), cellNumber(r.forecast), cellNumber(r.lower), cellNumber(r.upper)]);
}

/** Index (0-based) of the last row holding any non-empty cell, or -1. */
export function lastUsedRow(values: CellValue[][]): number {
  for (let i = values.length - 1; i >= 0; i--) {
    if (values[i].some((v) => v !== null && v !== '')) return i;
  }
  return -1;
}

/**
 * The last used sheet row (0-based) of the archive's columns, read in
 * chunks until a chunk is wholly empty; -1 for an empty sheet.
 */
export async function findLastUsedRow(port: WorkbookPort, sheet: string, width = WIDTH): Promise<number> {
  let last = -1;
  for (let start = 0; start < MAX_ROWS; start += CHUNK) {
    const end = Math.min(MAX_ROWS, start + CHUNK);
    const values = await port.readFormulas(`${quoteSheet(sheet)}!A${start + 1}:${columnName(width - 1)}${end}`);
    const used = lastUsedRow(values);
    if (used < 0) break;
    last = start + used;
  }
  return last;
}

/**
 * Appends one issue below the last used row of the archive sheet (adding
 * the sheet and its header when missing). Existing rows are never written:
 * the target is checked through writeWithConsent with an answer of no, so
 * a non-empty target cell stops the append instead of being overwritten.
 *
 * @returns the address written
 * @throws InputError when the cells below the last row are unexpectedly taken
 */
export async function appendToArchive(port: WorkbookPort, issue: Issue, rows: ForecastRow[]): Promise<string> {
  if (rows.length === 0) throw new InputError('there is no forecast to archive');
  await port.ensureSheet(ARCHIVE_SHEET);
  const last = await findLastUsedRow(port, ARCHIVE_SHEET);
  const values = archiveRows(issue, rows);
  if (last < 0) values.unshift(ARCHIVE_HEADER.slice());
  const top = last + 2; // 1-based row below the last used one
  if (top + values.length - 1 > MAX_ROWS) throw new InputError(`the sheet "${ARCHIVE_SHEET}" is full; start a new workbook for the archive`);
  const address = `${quoteSheet(ARCHIVE_SHEET)}!A${top}:${columnName(WIDTH - 1)}${top + values.length - 1}`;
  const formats: NumberFormat[][] = values.map((row, i) => row.map((_, c) => (last < 0 && i === 0) || c < 5 ? null : PRICE_FORMAT));
  const written = await writeWithConsent(port, async () => false, address, values, formats);
  if (!written) throw new InputError(`the rows below the archive's last row (${address}) are not empty; the archive was left as it is`);
  return address;
}

/**
 * Parses archive rows (header first or not) into entries; rows that are
 * blank are skipped, a row that does not parse is refused with its row.
 *
 * @throws InputError naming the sheet row and column
 */
export function parseArchive(values: CellValue[][], firstRow = 1): ArchiveEntry[] {
  const out: ArchiveEntry[] = [];
  values.forEach((row, i) => {
    const rowNumber = firstRow + i;
    if (!row.some((v) => v !== null && v !== '')) return;
    if (String(row[0] ?? '').trim().toLowerCase() === ARCHIVE_HEADER[0]) return;
    const where = (column: string) => ({ file: ARCHIVE_SHEET, row: rowNumber, column });
    const num = (k: number): number => {
      const v = row[k];
      if (v === null || v === '') return NaN;
      const n = typeof v === 'number' ? v : Number(String(v).trim());
      if (typeof v === 'boolean' || !Number.isFinite(n)) throw new InputError(`"${v}" is not a number`, where(ARCHIVE_HEADER[k]));
      return n;
    };
    out.push({
      row: rowNumber,
      issuedAt: parseTimestamp(String(row[0] ?? ''), where(ARCHIVE_HEADER[0])),
      model: String(row[1] ?? ''),
      created: String(row[2] ?? ''),
      version: String(row[3] ?? ''),
      time: parseTimestamp(String(row[4] ?? ''), where(ARCHIVE_HEADER[4])),
      forecast: num(5), lower: num(6), upper: num(7),
    });
  });
  return out;
}

/** Every archived entry of the workbook; none when the sheet is missing. */
export async function readArchive(port: WorkbookPort): Promise<ArchiveEntry[]> {
  if (!(await port.listSheets()).includes(ARCHIVE_SHEET)) return [];
  const last = await findLastUsedRow(port, ARCHIVE_SHEET);
  if (last < 0) return [];
  const values = await port.readRange(`${quoteSheet(ARCHIVE_SHEET)}!A1:${columnName(WIDTH - 1)}${last + 1}`);
  return parseArchive(values, 1);
}

export function quoteSheet(name: string): string {
  return /^[A-Za-z0-9_]+$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}
