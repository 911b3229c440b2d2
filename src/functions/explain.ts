import {
  byMagnitude, explainAhead, InputError, learnerFromStored, REFERENCE_CHOICES, type ReferenceChoice, type StoredModel,
} from '../engine';
import { isOmitted, textArg } from './cells';
import { seriesFromRanges, type RangeArgs } from './ranges-to-series';
import type { DateSystem } from './timestamps';

/**
 * LOOM.EXPLAIN: why the next delivery day's mean forecast differs from the
 * model's forecast of D-1 (or D-7), as two columns, input group and
 * contribution, largest first; the rows add up to the change
 * (engine/explain: exact Shapley values over the groups).
 *
 * @param against "d-1" (the default) or "d-7"
 * @example explain(stored, { times, prices, drivers }, 'd-1') // [['drivers_target', -10.8], ['price_lags', 9.3], ...]
 * @throws InputError for ranges the model cannot use, with what to fix
 */
export function explain(stored: StoredModel, args: RangeArgs, against: unknown, options: { dateSystem?: DateSystem } = {}): (string | number)[][] {
  const source = `model "${stored.name}"`;
  const choice = textArg(against, 'against', 'd-1').toLowerCase();
  if (!(REFERENCE_CHOICES as readonly string[]).includes(choice)) throw new InputError(`against must be "d-1" (the day before) or "d-7" (a week before), got "${choice}"`);
  const drivers = stored.setup.drivers;
  if (drivers.length && isOmitted(args.drivers)) {
    throw new InputError(`${source} was trained with the driver${drivers.length === 1 ? '' : 's'} ${drivers.join(', ')}: give their range (drivers), with driverTimes unless they sit on the rows of times`);
  }
  const { series } = seriesFromRanges(args, { zone: stored.zone, dateSystem: options.dateSystem, driverNames: drivers });
  if (series.resolution !== stored.resolution) {
    throw new InputError(`the ranges hold ${series.resolution}-minute periods but ${source} was trained on ${stored.resolution}-minute periods`);
  }
  const e = explainAhead(learnerFromStored(stored, source), series, drivers, choice as ReferenceChoice);
  return byMagnitude(e.contributions).map((c) => [c.group, c.value]);
}
