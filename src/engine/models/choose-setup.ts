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
  const scaleWindow = scaleWindowFor(s.scaleWindow, view.price.length);
  if (scaleWindow < s.scaleWindow) notes.push(`level scale over ${scaleWindow} days instead of ${s.scaleWindow}: the history is short (${view.price.length} days)`);
  if (groups.length === 0) throw new InputError('no feature group is left to train on; switch on price lags or add driver columns');
  const driverStats: FeatureSetup['driverStats'] = {};
  for (const name of drivers) {
    const values = view.drivers[name].slice(0, view.price.length).flatMap((r) => Array.from(r)).filter(Number.isFinite);
    if (values.length === 0) throw new InputError(`driver "${name}" has no known value in the training span`);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / values.length) || 1;
    driverStats[name] = { mean, sd };
  }
  return { setup: { groups, drivers, driverStats, region: s.region, scaleWindow, slots: view.slots }, notes };
}

/**
 * The level scale's window for a history of `days` days: the setting, but
 * at most a quarter of the history (at least 7 days), so a short history
 * keeps three quarters of its days to learn from.
 * @example scaleWindowFor(56, 28) // 7
 */
export function scaleWindowFor(setting: number, days: number): number {
  return Math.min(setting, Math.max(7, Math.floor(days / 4)));
}
