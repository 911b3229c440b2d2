import { InputError } from '../errors';
import { readTable, seriesFromRows, type BuildOptions, type IngestReport, type ReadRow } from './build-series';
import { formatTimestamp } from './format-timestamp';
import { quoteCell } from './quote-cell';
import type { Series } from './series';
import type { Table } from './table';

/**
 * The daily case with two files: the history (timestamps, prices, drivers)
 * and the forecast day's driver forecasts in a file of their own
 * (`timestamp` and the same driver columns, no price or an empty one).
 * The result is the series of the one-file form, the history with the
 * driver rows appended with empty prices, row for row.
 *
 * Rules, each refused with file, row and column when broken:
 * - the drivers file has exactly the history's driver columns (in any
 *   order, names compared without regard to case);
 * - its price column, if it has one, is empty (or holds missing markers);
 * - its timestamps come after the history's last known price;
 * - a period given in both files is refused, except a history row with no
 *   values at all (a prepared empty row), which the drivers row replaces.
 *
 * @example buildSeriesWithDrivers(parseCsv(history, 'history.csv'), parseCsv(tomorrow, 'drivers.csv'), { zone: 'Europe/Berlin' })
 * Source: common practice (the day-ahead routine: history, then the next day's driver forecasts).
 */
export function buildSeriesWithDrivers(history: Table, drivers: Table, options: BuildOptions): { series: Series; report: IngestReport } {
  const past = readTable(history, options);
  const next = readTable(drivers, { ...options, targetOptional: true });
  const order = matchColumns(past.drivers, next.drivers, past.file, next.file);

  const target = options.target ?? 'price';
  for (const r of next.rows) {
    if (!Number.isNaN(r.price)) {
      throw new InputError(
        `the drivers file gives the forecast day's driver forecasts only; leave ${target} empty or drop the column`,
        { file: next.file, row: r.row, column: next.targetColumn },
      );
    }
  }
  let lastPrice = -Infinity;
  for (const r of past.rows) if (!Number.isNaN(r.price) && r.time > lastPrice) lastPrice = r.time;
  const early = next.rows.find((r) => r.time <= lastPrice);
  if (early) {
    throw new InputError(
      `${quoteCell(early.stamp)} is not after the last price of ${past.file} (${formatTimestamp(lastPrice, options.zone)}); the drivers file holds the days still to be forecast`,
      { file: next.file, row: early.row, column: next.timeColumn },
    );
  }

  const given = new Map<number, ReadRow>(next.rows.map((r) => [r.time, r]));
  const kept = past.rows.filter((r) => {
    const other = given.get(r.time);
    if (!other) return true;
    if (r.drivers.every(Number.isNaN)) return false; // an empty prepared row: the drivers file fills it
    throw new InputError(
      `${quoteCell(other.stamp)} also has driver values in ${past.file} (row ${r.row}); give the forecast day's drivers in one of the two files`,
      { file: next.file, row: other.row, column: next.timeColumn },
    );
  });
  const appended = next.rows.map((r) => ({ ...r, drivers: order.map((j) => r.drivers[j]) }));
  return seriesFromRows([...kept, ...appended], {
    zone: options.zone, timeColumn: past.timeColumn, drivers: past.drivers, markedUnknown: past.markedUnknown + next.markedUnknown,
  });
}

/** For each history driver, its column index among the drivers file's drivers. */
function matchColumns(historyDrivers: string[], fileDrivers: string[], historyFile: string, driversFile: string): number[] {
  const lower = fileDrivers.map((d) => d.toLowerCase());
  const order = historyDrivers.map((name) => {
    const j = lower.indexOf(name.toLowerCase());
    if (j < 0) {
      throw new InputError(
        `lacks the driver column "${name}" that ${historyFile} has; the drivers file needs timestamp and the same driver columns (${historyDrivers.join(', ')})`,
        { file: driversFile, row: 1 },
      );
    }
    return j;
  });
  const extra = fileDrivers.find((d) => !historyDrivers.some((h) => h.toLowerCase() === d.toLowerCase()));
  if (extra !== undefined) {
    throw new InputError(
      `column ${quoteCell(extra)} is not a driver column of ${historyFile} (${historyDrivers.length ? historyDrivers.join(', ') : 'it has none'}); the drivers file needs timestamp and the same driver columns`,
      { file: driversFile, row: 1 },
    );
  }
  return order;
}
