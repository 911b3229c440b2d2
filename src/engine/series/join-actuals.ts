import { InputError } from '../errors';
import { readTable, seriesFromRows, type IngestReport } from './build-series';
import type { Series } from './series';
import type { Table } from './table';

/**
 * A file of issued forecasts (`timestamp` and forecast columns, as
 * `spotloom forecast --out` writes it) with its `actual` column taken from
 * a price series that came in later, matched on the instant. Periods the
 * prices do not reach yet stay unknown (scores skip them) and are counted.
 *
 * @param forecasts the issued file; it must not have an `actual` column of its own
 * @param actuals a price series (its `price` is the actual price)
 * @returns the series to score (target = actual) and how many periods found no price
 * @throws InputError when the issued file already has an actual column
 * @example buildSeriesWithActuals(parseCsv(issued, 'issued.csv'), pricesSeries, { zone: 'Europe/Berlin' })
 * Source: common practice (grading what was issued against the auction's prices).
 */
export function buildSeriesWithActuals(forecasts: Table, actuals: Series, options: { zone: string }): { series: Series; report: IngestReport; unmatched: number } {
  const read = readTable(forecasts, { zone: options.zone, target: 'actual', targetOptional: true });
  if (read.targetColumn !== undefined) {
    throw new InputError(`has an "${read.targetColumn}" column, and the actual prices come from another file too; give them in one place`, { file: read.file, row: 1, column: read.targetColumn });
  }
  const step = actuals.resolution * 60_000;
  const t0 = actuals.times[0];
  let unmatched = 0;
  const rows = read.rows.map((r) => {
    const k = (r.time - t0) / step;
    const price = Number.isInteger(k) && k >= 0 && k < actuals.times.length ? actuals.price[k] : NaN;
    if (Number.isNaN(price)) unmatched++;
    return { ...r, price };
  });
  const built = seriesFromRows(rows, { zone: options.zone, timeColumn: read.timeColumn, drivers: read.drivers, markedUnknown: read.markedUnknown });
  return { ...built, unmatched };
}
