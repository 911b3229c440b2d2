import { InputError, type Where } from '../errors';
import { inferResolution } from './infer-resolution';
import { checkZone } from './local-clock';
import { isMissingMarker } from './missing-markers';
import { parseNumber } from './parse-number';
import { quoteCell } from './quote-cell';
import type { Series } from './series';
import type { Table } from './table';
import { timestampReader } from './timestamp-reader';

// names that would reach an object's prototype machinery as keys of `drivers`
const RESERVED = new Set(['__proto__', 'constructor', 'prototype']);

/** Most periods a series may span, gaps included: far beyond any real history, small enough to fit in memory. */
export const MAX_PERIODS = 4_000_000;

export interface Gap {
  /** UTC ms of the first missing period */
  from: number;
  /** number of missing periods */
  periods: number;
}

/** What ingestion found, for the user to see before anything is trained. */
export interface IngestReport {
  rows: number;
  periods: number;
  gaps: Gap[];
  /** rows that were not in time order in the source (they are sorted) */
  outOfOrderRows: number;
  /** periods with an unknown price before the last known price */
  missingPrices: number;
  /** cells that held a missing marker such as NA or #N/A (read as unknown, like empty cells) */
  markedUnknown: number;
}

export interface BuildOptions {
  zone: string;
  /** name of the target column, `price` by default */
  target?: string;
}

/** One data row, read: its instant, target and drivers (NaN unknown) and where it came from. */
export interface ReadRow {
  time: number;
  price: number;
  drivers: number[];
  row: number;
  file: string;
  /** the timestamp cell as written, for messages */
  stamp: string;
}

/** The rows of one table, read but not yet laid on a grid. */
export interface ReadTable {
  file: string;
  /** the timestamp column's name as the header writes it */
  timeColumn: string;
  /** name of the target column as the header writes it, or undefined when the table has none */
  targetColumn: string | undefined;
  /** driver column names, in header order */
  drivers: string[];
  rows: ReadRow[];
  markedUnknown: number;
}

/**
 * Turns a table with a `timestamp` column, a target column and numeric
 * driver columns into a regular Series (see series.ts) and a report.
 * Numbers are read in the table's dialect (table.ts); in a table read from
 * a file (one with a dialect) a cell with a missing marker
 * (missing-markers.ts) is unknown; timestamps go through the one
 * timestamp reader (timestamp-reader.ts) in row order.
 *
 * @throws InputError naming the file, row and column for a missing header
 *   column, a cell that is not a number, a duplicate timestamp, or a period
 *   that is off the resolution's grid.
 */
export function buildSeries(table: Table, options: BuildOptions): { series: Series; report: IngestReport } {
  const read = readTable(table, options);
  return seriesFromRows(read.rows, { zone: options.zone, timeColumn: read.timeColumn, drivers: read.drivers, markedUnknown: read.markedUnknown });
}

/**
 * Reads a table's rows (stage one of buildSeries). With `targetOptional`
 * a table without a target column is read too (all targets unknown), as a
 * file of driver forecasts is.
 */
export function readTable(table: Table, options: BuildOptions & { targetOptional?: boolean }): ReadTable {
  const { zone, target = 'price', targetOptional = false } = options;
  checkZone(zone);
  const file = table.source;
  const header = table.header.map((h) => h.trim());
  const lower = header.map((h) => h.toLowerCase());
  const timeCol = lower.indexOf('timestamp');
  const targetCol = lower.indexOf(target.toLowerCase());
  if (timeCol < 0 || (targetCol < 0 && !targetOptional)) {
    const missing = timeCol < 0 ? 'timestamp' : target;
    const oneColumn = header.length === 1 ? '; it has one column: Spotloom reads files separated by , or ; or tab' : '';
    throw new InputError(
      `the header has no "${missing}" column; the first row must name the columns, e.g. timestamp,${target},temperature_forecast (found: ${clipHeader(header)})${oneColumn}`,
      { file, row: table.rowNumbers[0] ? table.rowNumbers[0] - 1 : 1 },
    );
  }
  const seen = new Set<string>();
  header.forEach((h, c) => {
    if (h === '') throw new InputError(`column ${c + 1} of the header has no name`, { file, row: 1 });
    if (/[\u0000-\u001f\u007f\u0085\u2028\u2029]/.test(h)) {
      throw new InputError(`column ${c + 1} of the header, ${quoteCell(h)}, holds a line break or control character; rename it`, { file, row: 1 });
    }
    if (RESERVED.has(h)) throw new InputError(`column name ${quoteCell(h)} is reserved; rename the column`, { file, row: 1 });
    if (seen.has(h.toLowerCase())) throw new InputError(`the header names column ${quoteCell(h)} twice`, { file, row: 1 });
    seen.add(h.toLowerCase());
  });
  if (table.rows.length === 0) throw new InputError('the file has a header but no data rows', { file });

  // a data file's dialect includes its missing markers; sheet ranges (no dialect) keep their own rules
  const decimal = table.dialect?.decimal ?? '.';
  const fromFile = table.dialect !== undefined;
  let markedUnknown = 0;
  const value = (text: string, where: Where) => {
    if (fromFile && text.trim() !== '' && isMissingMarker(text)) { markedUnknown++; return NaN; }
    return parseNumber(text, where, decimal);
  };
  const driverCols = header.map((_, c) => c).filter((c) => c !== timeCol && c !== targetCol);
  const reader = timestampReader(zone);
  const rows = table.rows.map((cells, i): ReadRow => {
    const row = table.rowNumbers[i];
    const time = reader.text(cells[timeCol], { file, row, column: header[timeCol] });
    const price = targetCol < 0 ? NaN : value(cells[targetCol], { file, row, column: header[targetCol] });
    const drivers = driverCols.map((c) => value(cells[c], { file, row, column: header[c] }));
    return { time, price, drivers, row, file, stamp: cells[timeCol] };
  });
  const repeated = reader.firstRepeated;
  if (repeated) {
    // the instant of a repeated wall-clock time comes from row order: only trustworthy when the rows are in time order
    const back = rows.findIndex((r, i) => i > 0 && r.time < rows[i - 1].time);
    if (back > 0) {
      throw new InputError(
        `is a wall-clock time that the autumn clock change repeats, and the rows are not in time order (row ${rows[back].row} comes before row ${rows[back - 1].row} in time), so which of the two instants is meant is unclear; sort the rows or give timestamps with their UTC offset`,
        repeated,
      );
    }
  }
  return {
    file, timeColumn: header[timeCol], targetColumn: targetCol < 0 ? undefined : header[targetCol],
    drivers: driverCols.map((c) => header[c]), rows, markedUnknown,
  };
}

export interface GridOptions {
  zone: string;
  /** the timestamp column's name, for messages */
  timeColumn: string;
  /** driver names, in the order of each row's `drivers` */
  drivers: string[];
  markedUnknown?: number;
}

/**
 * Lays read rows on the regular grid of a Series (stage two of
 * buildSeries): sorts them, refuses a timestamp given twice, finds the
 * resolution, marks gaps and counts missing prices.
 */
export function seriesFromRows(parsed: ReadRow[], options: GridOptions): { series: Series; report: IngestReport } {
  const { zone, timeColumn, drivers: names, markedUnknown = 0 } = options;
  let outOfOrderRows = 0;
  for (let i = 1; i < parsed.length; i++) if (parsed[i].time < parsed[i - 1].time) outOfOrderRows++;
  const sorted = outOfOrderRows ? [...parsed].sort((a, b) => a.time - b.time) : parsed;
  for (let i = 1; i < sorted.length; i++) {
    const a = sorted[i - 1], b = sorted[i];
    if (b.time !== a.time) continue;
    const later = a.file === b.file ? (b.row > a.row ? b : a) : b;
    const rowsText = a.file === b.file ? `rows ${Math.min(a.row, b.row)} and ${Math.max(a.row, b.row)}` : `${a.file} row ${a.row} and ${b.file} row ${b.row}`;
    throw new InputError(
      `timestamp ${quoteCell(later.stamp)} appears twice (${rowsText}); keep one of them`,
      { file: later.file, row: later.row, column: timeColumn },
    );
  }

  const resolution = inferResolution(sorted.map((p) => p.time));
  const step = resolution * 60_000;
  const t0 = sorted[0].time;
  const n = Math.round((sorted[sorted.length - 1].time - t0) / step) + 1;
  if (n > MAX_PERIODS) {
    const last = sorted[sorted.length - 1];
    throw new InputError(
      `the rows span ${n} periods of ${resolution} minutes, from row ${sorted[0].row} to row ${last.row}; Spotloom reads at most ${MAX_PERIODS} (over 100 years of quarter-hours): check those timestamps for a wrong year`,
      { file: last.file, column: timeColumn },
    );
  }
  const times = Array.from({ length: n }, (_, i) => t0 + i * step);
  const price = new Array<number>(n).fill(NaN);
  const drivers: Record<string, number[]> = {};
  names.forEach((name) => (drivers[name] = new Array<number>(n).fill(NaN)));
  const present = new Uint8Array(n);
  for (const p of sorted) {
    const k = (p.time - t0) / step;
    if (!Number.isInteger(k)) {
      throw new InputError(
        `this period does not start on the ${resolution}-minute grid of the other rows`,
        { file: p.file, row: p.row, column: timeColumn },
      );
    }
    present[k] = 1;
    price[k] = p.price;
    names.forEach((name, j) => (drivers[name][k] = p.drivers[j]));
  }

  const gaps: Gap[] = [];
  for (let k = 0; k < n; k++) {
    if (present[k]) continue;
    const last = gaps[gaps.length - 1];
    if (last && last.from + last.periods * step === times[k]) last.periods++;
    else gaps.push({ from: times[k], periods: 1 });
  }
  let lastKnown = -1;
  for (let k = n - 1; k >= 0; k--) if (!Number.isNaN(price[k])) { lastKnown = k; break; }
  let missingPrices = 0;
  for (let k = 0; k <= lastKnown; k++) if (Number.isNaN(price[k])) missingPrices++;

  return {
    series: { times, price, drivers, resolution, zone },
    report: { rows: parsed.length, periods: n, gaps, outOfOrderRows, missingPrices, markedUnknown },
  };
}

function clipHeader(header: string[]): string {
  return quoteCell(header.join(','), 60);
}
