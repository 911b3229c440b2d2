import { baselineModel, forecastAhead, InputError, toWallClock, type BaselineKind } from '../engine';
import { textArg } from './cells';
import { cachedSeries } from './range-cache';
import { seriesFromRanges } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * LOOM.BASELINE: a naive forecast of every delivery period of the next day
 * after the last known price, as one column. Kinds (the engine's naive
 * baselines, by local clock slot):
 * - `day`: the same period of the day before;
 * - `week` (default): the same period one week before;
 * - `weekday-rule`: a week before for Monday, Saturday and Sunday, the day
 *   before otherwise (the naive benchmark of the day-ahead literature).
 *
 * Timestamps are read in `zone` (default Europe/Berlin, the design's market
 * default); timestamps whose UTC offset belongs to another zone are refused,
 * so name the market's zone for other markets.
 *
 * @example baseline(times, prices, 'day') // [[38.2], [36.9], ...]
 */
const KINDS: Record<string, BaselineKind> = {
  day: 'naive-day', 'naive-day': 'naive-day',
  week: 'naive-week', 'naive-week': 'naive-week',
  'weekday-rule': 'weekday-rule', weekday: 'weekday-rule',
};

export const DEFAULT_ZONE = 'Europe/Berlin';

export function baseline(times: unknown, prices: unknown, kind: unknown, zone: unknown, options: { dateSystem?: DateSystem } = {}): number[][] {
  const name = textArg(kind, 'kind', 'week').toLowerCase();
  const model = KINDS[name];
  if (!model) throw new InputError(`kind "${name}" is not a baseline; use "day", "week" or "weekday-rule"`);
  const z = textArg(zone, 'zone', DEFAULT_ZONE);
  const args = { times, prices }, seriesOptions = { zone: z, dateSystem: options.dateSystem };
  const { series } = cachedSeries(args, seriesOptions, () => seriesFromRanges(args, seriesOptions));
  const { rows, days } = forecastAhead(baselineModel(model), series, []);
  const day = days[0];
  const mine = rows.filter((r) => toWallClock(r.time, z).date === day);
  if (mine.some((r) => !Number.isFinite(r.forecast))) {
    throw new InputError(`the ${name} baseline for ${day} needs prices ${model === 'naive-day' ? 'of the day before' : 'of the week before'}; give a longer price history`);
  }
  return mine.map((r) => [r.forecast]);
}
