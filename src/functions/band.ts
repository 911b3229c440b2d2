import { InputError, type StoredModel } from '../engine';
import { numberArg } from './cells';
import { nextDay } from './next-day';
import type { RangeArgs } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * LOOM.BAND: lower and upper edge of the forecast band for every delivery
 * period of the next day (two columns beside LOOM.AHEAD's one). The band is
 * the model's: empirical quantiles of its recent out-of-sample errors, here
 * at `coverage` (0.9 gives the 5 % and 95 % quantiles).
 *
 * @param coverage a fraction in (0.5, 1); omitted: 0.9
 * @example band(stored, { times, prices, drivers }, 0.8) // [[35.1, 47.9], ...]
 */
export function band(stored: StoredModel, args: RangeArgs, coverage: unknown, options: { dateSystem?: DateSystem } = {}): number[][] {
  const c = numberArg(coverage, 'coverage', 0.9);
  if (!(c > 0.5 && c < 1)) {
    throw new InputError(`coverage must be a fraction between 0.5 and 1, e.g. 0.9 for a 90 % band; got ${c}`);
  }
  const { day, rows } = nextDay(stored, args, { ...options, coverage: c });
  if (rows.some((r) => !Number.isFinite(r.lower) || !Number.isFinite(r.upper))) {
    throw new InputError(`model "${stored.name}" has too few recorded errors to set a band for ${day}; retrain it with a longer validation span`);
  }
  return rows.map((r) => [r.lower, r.upper]);
}
