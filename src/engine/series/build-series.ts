import { InputError, type Where } from '../errors';
import { inferResolution } from './infer-resolution';
import { checkZone } from './local-clock';
import { parseNumber } from './parse-number';
import { parseTimestamp } from './parse-timestamp';
import { quoteCell } from './quote-cell';
import type { Series } from './series';
import type { Table } from './table';

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
}

export interface BuildOptions {
  zone: string;
  /** name of the target column, `price` by default */
  target?: string;
  /** how a timestamp cell becomes UTC ms; ISO 8601 with offset by default */
  parseTime?: (text: string, where: Where) => number;
}

/**
 * Turns a table with a `timestamp` column, a target column and numeric
 * driver columns into a regular Series (see series.ts) and a report.
 *
 * @throws InputError naming the file, row and column for a missing header
 *   column, a cell that is not a number, a duplicate timestamp, or a period
 *   that is off the resolution's grid.
 */
export function buildSeries(table: Table, options: BuildOptions): { series: Series; report: IngestReport } {
  const { zone, target = 'price', parseTime = parseTimestamp } = options;
  checkZone(zone);
  const file = table.source;
  const header = table.header.map((h) => h.trim());
  const lower = header.map((h) => h.toLowerCase());
  const timeCol = lower.indexOf('timestamp');
  const targetCol = lower.indexOf(target.toLowerCase());
  if (timeCol < 0 || targetCol < 0) {
    const missing = timeCol < 0 ? 'timestamp' : target;
    throw new InputError(
      `the header has no "${missing}" column; the first row must name the columns, e.g. timestamp,${target},temperature_forecast (found: ${clipHeader(header)})`,
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

  const driverCols = header.map((_, c) => c).filter((c) => c !== timeCol && c !== targetCol);
  const parsed = table.rows.map((cells, i) => {
    const row = table.rowNumbers[i];
    const time = parseTime(cells[timeCol], { file, row, column: header[timeCol] });
    const price = parseNumber(cells[targetCol], { file, row, column: header[targetCol] });
    const drivers = driverCols.map((c) => parseNumber(cells[c], { file, row, column: header[c] }));
    return { time, price, drivers, row };
  });

  let outOfOrderRows = 0;
  for (let i = 1; i < parsed.length; i++) if (parsed[i].time < parsed[i - 1].time) outOfOrderRows++;
  const sorted = outOfOrderRows ? [...parsed].sort((a, b) => a.time - b.time) : parsed;
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i].time === sorted[i - 1].time) {
      throw new InputError(
        `timestamp ${quoteCell(table.rows[parsed.indexOf(sorted[i])][timeCol])} appears twice (rows ${sorted[i - 1].row} and ${sorted[i].row}); keep one of them`,
        { file, row: Math.max(sorted[i - 1].row, sorted[i].row), column: header[timeCol] },
      );
    }
  }

  const resolution = inferResolution(sorted.map((p) => p.time));
  const step = resolution * 60_000;
  const t0 = sorted[0].time;
  const n = Math.round((sorted[sorted.length - 1].time - t0) / step) + 1;
  if (n > MAX_PERIODS) {
    const last = sorted[sorted.length - 1];
    throw new InputError(
      `the rows span ${n} periods of ${resolution} minutes, from row ${sorted[0].row} to row ${last.row}; Spotloom reads at most ${MAX_PERIODS} (over 100 years of quarter-hours): check those timestamps for a wrong year`,
      { file, column: header[timeCol] },
    );
  }
  const times = Array.from({ length: n }, (_, i) => t0 + i * step);
  const price = new Array<number>(n).fill(NaN);
  const drivers: Record<string, number[]> = {};
  driverCols.forEach((c) => (drivers[header[c]] = new Array<number>(n).fill(NaN)));
  const names = driverCols.map((c) => header[c]);
  const present = new Uint8Array(n);
  for (const p of sorted) {
    const k = (p.time - t0) / step;
    if (!Number.isInteger(k)) {
      throw new InputError(
        `this period does not start on the ${resolution}-minute grid of the other rows`,
        { file, row: p.row, column: header[timeCol] },
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
    report: { rows: table.rows.length, periods: n, gaps, outOfOrderRows, missingPrices },
  };
}

function clipHeader(header: string[]): string {
  return quoteCell(header.join(','), 60);
}
