import { InputError, type StoredModel } from '../engine';
import { nextDay } from './next-day';
import type { RangeArgs } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * LOOM.AHEAD: the forecast of every delivery period of the next day after
 * the last known price, as one column (23, 24 or 25 rows for hourly
 * periods; 4 per hour for quarter-hours).
 *
 * @example ahead(stored, { times, prices, drivers }) // [[41.2], [39.8], ...]
 */
export function ahead(stored: StoredModel, args: RangeArgs, options: { dateSystem?: DateSystem } = {}): number[][] {
  const { day, rows } = nextDay(stored, args, options);
  if (rows.some((r) => !Number.isFinite(r.forecast))) {
    throw new InputError(`model "${stored.name}" could not forecast every period of ${day}; check the price history before it`);
  }
  return rows.map((r) => [r.forecast]);
}
