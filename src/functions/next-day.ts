import {
  forecastAhead, InputError, Learner, learnerFromStored, toWallClock,
  type AheadRow, type StoredModel,
} from '../engine';
import { isOmitted } from './cells';
import { cachedSeries } from './range-cache';
import { seriesFromRanges, type RangeArgs } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * A stored model's forecast of the delivery day right after the last known
 * price in the ranges (LOOM.AHEAD and LOOM.BAND): the model's zone and
 * resolution rule the timestamps, its drivers must be given.
 *
 * Each forecast works on a fresh learner made from the stored model: a
 * learner takes the errors of its earlier forecasts into its band pool when
 * it predicts again, so a shared one would make a cell's value depend on the
 * order in which the host recalculates cells. What a sheet of such cells
 * repeats is computed once: the series of the same ranges (range-cache.ts)
 * and the forecast of one model on one series at one coverage, kept with the
 * loaded model (a saved, replaced or deleted model is a new object), whose
 * decoded form is kept too (freshLearner).
 *
 * @param coverage band coverage in (0.5, 1); the model's own when omitted
 * @throws InputError for ranges the model cannot use, with what to fix
 */
export function nextDay(stored: StoredModel, args: RangeArgs, options: { dateSystem?: DateSystem; coverage?: number } = {}): { day: string; rows: AheadRow[] } {
  const source = `model "${stored.name}"`;
  const drivers = stored.setup.drivers;
  if (drivers.length && isOmitted(args.drivers)) {
    throw new InputError(`${source} was trained with the driver${drivers.length === 1 ? '' : 's'} ${drivers.join(', ')}: give their range (drivers), with driverTimes unless they sit on the rows of times`);
  }
  const { coverage } = options;
  const seriesOptions = { zone: stored.zone, dateSystem: options.dateSystem, driverNames: drivers };
  const read = cachedSeries(args, seriesOptions, () => seriesFromRanges(args, seriesOptions));
  const { series } = read;
  if (series.resolution !== stored.resolution) {
    throw new InputError(`the ranges hold ${series.resolution}-minute periods but ${source} was trained on ${stored.resolution}-minute periods`);
  }
  const key = `${read.id}|${coverage ?? ''}`;
  let forecasts = computed.get(stored);
  if (!forecasts) computed.set(stored, (forecasts = new Map()));
  const hit = forecasts.get(key);
  if (hit) return hit;
  const { rows, days } = forecastAhead(freshLearner(stored, source, coverage), series, drivers);
  const day = days[0];
  const result = { day, rows: rows.filter((r) => toWallClock(r.time, stored.zone).date === day) };
  forecasts.set(key, result);
  // the few most recent (series, coverage) pairs per model
  for (const old of [...forecasts.keys()].slice(0, Math.max(0, forecasts.size - MAX_FORECASTS))) forecasts.delete(old);
  return result;
}

const MAX_FORECASTS = 64;

/**
 * A fresh learner of the stored model: the model is decoded once per loaded
 * model (learnerFromStored: checks, unpacking) and each learner gets its own
 * band pool (the only part a forecast changes), sharing the rest.
 */
const decoded = new WeakMap<StoredModel, Learner>();

function freshLearner(stored: StoredModel, source: string, coverage: number | undefined): Learner {
  let template = decoded.get(stored);
  if (!template) decoded.set(stored, (template = learnerFromStored(stored, source)));
  const state = template.state!;
  const residuals = { keep: state.residuals.keep, bySlot: state.residuals.bySlot.map((r) => r.slice()) };
  return new Learner(coverage === undefined ? template.settings : { ...template.settings, coverage }, { ...state, residuals });
}
const computed = new WeakMap<StoredModel, Map<string, { day: string; rows: AheadRow[] }>>();
