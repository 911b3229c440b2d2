import { forecastAhead, formatTimestamp, InputError, learnerFromStored, type StoredModel } from '../../engine';
import type { ForecastRow } from './place-layout';
import type { DataCheck } from './read-ranges';

/**
 * Tomorrow's forecast from a stored model and the checked data: the
 * delivery day after the last known price (and further days when their
 * driver rows are there), the same thing LOOM.AHEAD computes in a cell.
 *
 * @throws InputError when the model does not fit the data (zone, resolution,
 *   a driver it was trained with), or tomorrow's driver rows are missing
 */
export function forecastTomorrow(stored: StoredModel, data: Pick<DataCheck, 'series'>): { rows: ForecastRow[]; days: string[] } {
  checkModelFits(stored, data);
  const learner = learnerFromStored(stored, `model "${stored.name}"`);
  return forecastAhead(learner, data.series, stored.setup.drivers);
}

/**
 * Refuses a model that does not fit the checked data: another zone or
 * resolution, or a driver it was trained with that the data lacks.
 *
 * @throws InputError naming what to change
 */
export function checkModelFits(stored: StoredModel, data: Pick<DataCheck, 'series'>): void {
  const { series } = data;
  if (stored.zone !== series.zone) {
    throw new InputError(`model "${stored.name}" was trained for time zone ${stored.zone}, but Data uses ${series.zone}; set the market time zone to ${stored.zone}`);
  }
  if (stored.resolution !== series.resolution) {
    throw new InputError(`model "${stored.name}" was trained on ${stored.resolution}-minute periods, but the data has ${series.resolution}-minute periods`);
  }
  const missing = stored.setup.drivers.filter((d) => !(d in series.drivers));
  if (missing.length) {
    throw new InputError(`model "${stored.name}" was trained with the driver "${missing[0]}", which the picked driver ranges do not have (found: ${Object.keys(series.drivers).join(', ') || 'none'})`);
  }
}

/** The rows of one local delivery day (`YYYY-MM-DD` in `zone`). */
export function rowsOfDay(rows: ForecastRow[], date: string, zone: string): ForecastRow[] {
  return rows.filter((r) => formatTimestamp(r.time, zone).slice(0, 10) === date);
}
