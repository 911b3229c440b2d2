import { isBridgeDay } from '../calendar/bridge-days';
import { holidayName } from '../calendar/holidays';
import { addDays, isoWeekday } from '../calendar/weekday';
import { targetDay, type DayFrame } from '../series/day-frame';
import { driverRoles } from './driver-roles';
import type { FeatureGroup } from './feature-groups';
import { hourly } from './hourly';
import { levelScale, toScaled, type LevelScale } from './level-scale';

/** Everything that fixes the meaning of a feature vector; stored with the model. */
export interface FeatureSetup {
  groups: FeatureGroup[];
  drivers: string[];
  /** mean and standard deviation of each driver over the training span */
  driverStats: Record<string, { mean: number; sd: number }>;
  region?: string;
  /** days of prices that set each day's level scale */
  scaleWindow: number;
  slots: number;
}

const HOURS = 24;
const PRICE_LAGS = [1, 2, 3, 7];
/** lags kept at full resolution: the same quarter-hour of D-1 and D-7 carries the intra-hour shape */
const FINE_LAGS = new Set([1, 7]);
const YEAR_LAG = 364;


/**
 * Days of price history a feature vector needs before its target day. The
 * year-ago prices are not among them: a day less than a year into the
 * history takes 0 there (the centre of its level scale), so switching the
 * group on never costs the first year of training days.
 */
export function historyNeeded(setup: FeatureSetup): number {
  return Math.max(setup.groups.includes('price_changes') ? 8 : 7, setup.scaleWindow);
}

/** The features of each enabled group, in vector order (for importance and the pane). */
export function featureLayout(setup: FeatureSetup): { group: FeatureGroup; names: string[] }[] {
  const layout: { group: FeatureGroup; names: string[] }[] = [];
  const add = (group: FeatureGroup, names: string[]) => { if (setup.groups.includes(group) && names.length) layout.push({ group, names }); };
  const profile = (prefix: string) => Array.from({ length: HOURS }, (_, h) => `${prefix}_h${String(h).padStart(2, '0')}`);
  const fine = (prefix: string) => setup.slots === HOURS ? profile(prefix)
    : Array.from({ length: setup.slots }, (_, k) => `${prefix}_s${String(k).padStart(2, '0')}`);
  add('price_lags', PRICE_LAGS.flatMap((lag) => (FINE_LAGS.has(lag) ? fine(`price_d${lag}`) : profile(`price_d${lag}`))));
  add('price_d1_stats', ['price_d1_mean', 'price_d1_min', 'price_d1_max']);
  add('price_year_ago', profile('price_d364'));
  add('price_changes', ['mean_change_d1_d2', 'mean_change_d1_d8']);
  add('drivers_target', setup.drivers.flatMap((k) => profile(`${k}_d0`)));
  add('drivers_lagged', setup.drivers.flatMap((k) => [...profile(`${k}_d1`), ...profile(`${k}_d7`)]));
  add('residual_load', hasResidualLoad(setup) ? profile('residual_load_d0') : []);
  add('weekday', Array.from({ length: 7 }, (_, w) => `weekday_${w + 1}`));
  add('month', ['month_sin', 'month_cos']);
  add('holidays', setup.region ? ['holiday_d0', 'bridge_d0', 'holiday_d1'] : []);
  return layout;
}

export function featureNames(setup: FeatureSetup): string[] {
  return featureLayout(setup).flatMap((g) => g.names);
}

/**
 * The feature vector for the target day of `view` (the day after its last
 * price row) and that day's level scale. Reads only price rows before the
 * target day and driver rows up to it.
 *
 * @returns undefined when an input is unknown (the day cannot be used)
 */
export function dayFeatures(view: DayFrame, setup: FeatureSetup): { x: Float64Array; scale: LevelScale } | undefined {
  const d = targetDay(view);
  if (d < historyNeeded(setup)) return undefined;
  const scale = levelScale(view.price, d, setup.scaleWindow);
  if (!scale) return undefined;
  const perHour = setup.slots / HOURS;
  const out: number[] = [];
  const g = new Set(setup.groups);
  const z = (p: number) => toScaled(p, scale);
  const priceProfile = (lag: number, full = false) => { for (const v of full ? view.price[d - lag] : hourly(view.price[d - lag], perHour)) out.push(z(v)); };
  const driverRow = (name: string, lag: number) => {
    const { mean, sd } = setup.driverStats[name];
    return hourly(view.drivers[name][d - lag], perHour).map((v) => (v - mean) / sd);
  };
  const dailyMean = (lag: number) => mean(view.price[d - lag]);

  if (g.has('price_lags')) for (const lag of PRICE_LAGS) priceProfile(lag, FINE_LAGS.has(lag));
  if (g.has('price_d1_stats')) {
    const row = view.price[d - 1];
    out.push(z(mean(row)), z(Math.min(...row)), z(Math.max(...row)));
  }
  if (g.has('price_year_ago')) {
    if (d >= YEAR_LAG) priceProfile(YEAR_LAG);
    else for (let h = 0; h < HOURS; h++) out.push(0);
  }
  if (g.has('price_changes')) out.push(z(dailyMean(1)) - z(dailyMean(2)), z(dailyMean(1)) - z(dailyMean(8)));
  if (g.has('drivers_target')) for (const k of setup.drivers) out.push(...driverRow(k, 0));
  if (g.has('drivers_lagged')) for (const k of setup.drivers) out.push(...driverRow(k, 1), ...driverRow(k, 7));
  if (g.has('residual_load') && hasResidualLoad(setup)) out.push(...residualLoad(view, setup, d, perHour));
  const date = view.days[d].date;
  if (g.has('weekday')) { const w = isoWeekday(date); for (let k = 1; k <= 7; k++) out.push(k === w ? 1 : 0); }
  if (g.has('month')) {
    const angle = (2 * Math.PI * (+date.slice(5, 7) - 1)) / 12;
    out.push(Math.sin(angle), Math.cos(angle));
  }
  if (g.has('holidays') && setup.region) {
    out.push(holidayName(date, setup.region) ? 1 : 0, isBridgeDay(date, setup.region) ? 1 : 0, holidayName(addDays(date, -1), setup.region) ? 1 : 0);
  }
  const x = Float64Array.from(out);
  for (const v of x) if (!Number.isFinite(v)) return undefined;
  return { x, scale };
}

function hasResidualLoad(setup: FeatureSetup): boolean {
  const roles = driverRoles(setup.drivers);
  return roles.load !== undefined && roles.renewables.length > 0;
}

/** load minus renewables, standardised by the load's own statistics */
function residualLoad(view: DayFrame, setup: FeatureSetup, d: number, perHour: number): Float64Array {
  const { load, renewables } = driverRoles(setup.drivers);
  const row = Float64Array.from(view.drivers[load!][d]);
  for (const r of renewables) { const ren = view.drivers[r][d]; for (let s = 0; s < row.length; s++) row[s] -= ren[s]; }
  const { mean: m, sd } = setup.driverStats[load!];
  return hourly(row, perHour).map((v) => (v - m) / sd);
}

function mean(row: Float64Array): number {
  let s = 0;
  for (const v of row) s += v;
  return s / row.length;
}
