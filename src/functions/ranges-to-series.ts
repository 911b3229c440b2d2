import { buildSeries, checkZone, InputError, type IngestReport, type Series, type Table } from '../engine';
import { cellGrid, cellList, isBlank, isOmitted, numberText } from './cells';
import { ContentCache } from './range-cache';
import { readTimes, type DateSystem } from './timestamps';

/**
 * The ranges of a LOOM.AHEAD / LOOM.BAND / LOOM.BASELINE call as one
 * regular Series (the engine's layout: series.ts):
 *
 * - `times` and `prices`: one column (or row) each, the same length; a row
 *   whose timestamp and price are both empty is skipped (a range picked a
 *   little too long), a price without a timestamp is refused; when both
 *   start with a text cell that is neither a date nor a number (column
 *   titles such as "timestamp" and "price"), that first row is skipped;
 * - `drivers`: columns of known-ahead drivers. A first row of text names
 *   them; without one, the columns are taken in the model's driver order.
 *   `driverTimes` gives their rows' timestamps; without it the driver rows
 *   line up with `times` (one table: history, then tomorrow's rows with
 *   drivers and an empty price).
 *
 * Rows of prices and drivers are joined on their instant; the engine's
 * series builder then checks the grid, finds the resolution and marks gaps.
 */
export interface RangeArgs {
  times: unknown;
  prices: unknown;
  driverTimes?: unknown;
  drivers?: unknown;
}

export interface SeriesOptions {
  zone: string;
  dateSystem?: DateSystem;
  /** the driver names the model was trained with, in its order (none: drivers are ignored) */
  driverNames?: string[];
}

interface Row {
  price: string;
  drivers: string[];
  from: number;
}

export function seriesFromRanges(args: RangeArgs, options: SeriesOptions): { series: Series; report: IngestReport } {
  const { zone, dateSystem = '1900', driverNames = [] } = options;
  checkZone(zone);
  const timeCells = cellList(args.times, 'times');
  const priceCells = cellList(args.prices, 'prices');
  if (timeCells.length !== priceCells.length) {
    throw new InputError(`times has ${timeCells.length} cells but prices has ${priceCells.length}; give ranges of the same height`);
  }
  const titled = isTitle(timeCells[0]) && isTitle(priceCells[0]);
  const skip = titled ? 1 : 0;
  const times = [...new Array<undefined>(skip), ...cachedTimes(timeCells.slice(skip), zone, 'times', dateSystem, 1 + skip)];
  const rows = new Map<number, Row>();
  const firstRow = new Map<number, number>();
  times.forEach((t, i) => {
    if (i < skip) return;
    const price = numberText(priceCells[i], { column: 'prices', row: i + 1 });
    if (t === undefined) {
      if (price !== '') throw new InputError('has a price but no timestamp', { column: 'times', row: i + 1 });
      return;
    }
    if (rows.has(t)) throw duplicate('times', firstRow.get(t)!, i + 1);
    rows.set(t, { price, drivers: driverNames.map(() => ''), from: i + 1 });
    firstRow.set(t, i + 1);
  });

  if (driverNames.length && !isOmitted(args.drivers)) addDrivers(rows, times, titled, args, driverNames, zone, dateSystem);

  const ordered = [...rows.entries()].sort((a, b) => a[0] - b[0]);
  if (ordered.length === 0) throw new InputError('times holds no timestamp');
  const table: Table = {
    source: 'the ranges',
    header: ['timestamp', 'price', ...driverNames],
    rows: ordered.map(([t, r]) => [new Date(t).toISOString(), r.price, ...r.drivers]),
    rowNumbers: ordered.map(([, r]) => r.from),
  };
  return buildSeries(table, { zone });
}

function addDrivers(rows: Map<number, Row>, times: (number | undefined)[], titled: boolean, args: RangeArgs, names: string[], zone: string, dateSystem: DateSystem): void {
  let grid = cellGrid(args.drivers);
  if (grid.length === 0 || grid[0].length === 0) {
    throw new InputError(`drivers is empty; give the ${names.length} driver column${names.length === 1 ? '' : 's'} the model uses (${names.join(', ')})`);
  }
  const header = grid[0].every(isTitle);
  const columns = header ? names.map((name) => columnOf(grid[0] as string[], name, names)) : names.map((_, k) => k);
  if (!header && grid[0].length !== names.length) {
    throw new InputError(
      `drivers has ${grid[0].length} column${grid[0].length === 1 ? '' : 's'} but the model uses ${names.length} driver${names.length === 1 ? '' : 's'} (${names.join(', ')}); give them in that order or put their names in a first row`,
    );
  }
  if (header) grid = grid.slice(1);
  let driverTimes: (number | undefined)[];
  const aligned = isOmitted(args.driverTimes);
  if (aligned) {
    if (header !== titled || grid.length !== times.length - (titled ? 1 : 0)) {
      throw new InputError(`drivers (${grid.length + (header ? 1 : 0)} rows) does not line up with times (${times.length} rows); give driverTimes, or driver ranges on the same rows as times`);
    }
    driverTimes = titled ? times.slice(1) : times;
  } else {
    let cells = cellList(args.driverTimes, 'driverTimes');
    if (header && cells.length === grid.length + 1) cells = cells.slice(1);
    if (cells.length !== grid.length) {
      throw new InputError(`driverTimes has ${cells.length} cells but drivers has ${grid.length} rows of values; give ranges of the same height`);
    }
    driverTimes = cachedTimes(cells, zone, 'driverTimes', dateSystem, 1);
  }
  const seen = new Map<number, number>();
  const offset = header ? 2 : 1;
  driverTimes.forEach((t, i) => {
    const values = columns.map((c) => numberText(grid[i][c], { column: names[columns.indexOf(c)], row: i + offset }));
    if (t === undefined) {
      if (values.some((v) => v !== '')) throw new InputError('has driver values but no timestamp', { column: 'driverTimes', row: i + offset });
      return;
    }
    if (seen.has(t) && !aligned) throw duplicate('driverTimes', seen.get(t)!, i + 1);
    seen.set(t, i + 1);
    const row = rows.get(t) ?? { price: '', drivers: names.map(() => ''), from: i + 1 };
    row.drivers = values;
    rows.set(t, row);
  });
}

function columnOf(header: string[], name: string, names: string[]): number {
  const k = header.findIndex((h) => h.trim().toLowerCase() === name.toLowerCase());
  if (k < 0) {
    throw new InputError(`drivers has no column named "${name}" (its first row names ${header.map((h) => `"${h.trim()}"`).join(', ')}); the model uses ${names.join(', ')}`);
  }
  return k;
}

function duplicate(what: string, first: number, second: number): InputError {
  return new InputError(`${what} rows ${first} and ${second} are the same delivery period; keep one of them`);
}

/** A column title: text that cannot be a number, a date or a timestamp (those start with a digit, a sign or a point). */
function isTitle(v: unknown): boolean {
  return typeof v === 'string' && !isBlank(v) && !/^[+-]?[\d.]/.test(v.trim());
}

/**
 * Timestamps read from a range, kept for the next call with the same cells
 * (range-cache.ts): reading them through the zone's clock is the costly part
 * of a call, and a price edit leaves them as they were.
 */
const timesCache = new ContentCache<(number | undefined)[]>(8);

function cachedTimes(cells: unknown[], zone: string, what: string, dateSystem: DateSystem, firstRow: number): (number | undefined)[] {
  return timesCache.get([zone, what, dateSystem, firstRow, ...cells], () => readTimes(cells, zone, what, dateSystem, firstRow)).value;
}
