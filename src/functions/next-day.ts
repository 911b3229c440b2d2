import {
  forecastAhead, InputError, learnerFromStored, toWallClock,
  type AheadRow, type StoredModel,
} from '../engine';
import { isOmitted } from './cells';
import { seriesFromRanges, type RangeArgs } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * A stored model's forecast of the delivery day right after the last known
 * price in the ranges (LOOM.AHEAD and LOOM.BAND): the model's zone and
 * resolution rule the timestamps, its drivers must be given.
 *
 * Each call works on a fresh learner made from the stored model: a learner
 * takes the errors of its earlier forecasts into its band pool when it
 * predicts again, so a shared one would make a cell's value depend on the
 * order in which the host recalculates cells.
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
  const settings = coverage === undefined ? stored : { ...stored, settings: { ...stored.settings, coverage } };
  const learner = learnerFromStored(settings, source);
  const { series } = seriesFromRanges(args, { zone: stored.zone, dateSystem: options.dateSystem, driverNames: drivers });
  if (series.resolution !== stored.resolution) {
    throw new InputError(`the ranges hold ${series.resolution}-minute periods but ${source} was trained on ${stored.resolution}-minute periods`);
  }
  const { rows, days } = forecastAhead(learner, series, drivers);
  const day = days[0];
  return { day, rows: rows.filter((r) => toWallClock(r.time, stored.zone).date === day) };
}
