import { InputError } from '../errors';
import type { FeatureSetup } from '../features/day-features';
import type { FeatureGroup } from '../features/feature-groups';
import type { DayFrame } from '../series/day-frame';
import type { LearnerSettings } from './learner-settings';

/**
 * The feature setup a learner trains with: the groups asked for, less those
 * the data cannot feed (each with a note), and each driver's mean and
 * standard deviation over the training span.
 *
 * @throws InputError when no group is left or a driver has no known value
 */
export function chooseSetup(view: DayFrame, s: LearnerSettings): { setup: FeatureSetup; notes: string[] } {
  const notes: string[] = [];
  const drivers = Object.keys(view.drivers);
  let groups: FeatureGroup[] = [...s.groups];
  const drop = (g: FeatureGroup, why: string) => {
    if (groups.includes(g)) { groups = groups.filter((x) => x !== g); notes.push(`${g} left out: ${why}`); }
  };
  if (view.price.length < 364 + 365) drop('price_year_ago', 'less than two years of history');
  if (!s.region) drop('holidays', 'no holiday region given');
  if (drivers.length === 0) { drop('drivers_target', 'no driver columns'); drop('drivers_lagged', 'no driver columns'); drop('residual_load', 'no driver columns'); }
  if (groups.length === 0) throw new InputError('no feature group is left to train on; switch on price lags or add driver columns');
  const driverStats: FeatureSetup['driverStats'] = {};
  for (const name of drivers) {
    const values = view.drivers[name].slice(0, view.price.length).flatMap((r) => Array.from(r)).filter(Number.isFinite);
    if (values.length === 0) throw new InputError(`driver "${name}" has no known value in the training span`);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / values.length) || 1;
    driverStats[name] = { mean, sd };
  }
  return { setup: { groups, drivers, driverStats, region: s.region, scaleWindow: s.scaleWindow, slots: view.slots }, notes };
}
