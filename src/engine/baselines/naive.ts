import { isoWeekday } from '../calendar/weekday';
import type { DayFrame } from '../series/day-frame';
import type { DayAheadModel, DayForecast } from '../models/model';

/**
 * Naive day-ahead baselines, by local clock slot (day-matrix.ts says how
 * the skipped and the repeated hour of daylight-saving days are handled):
 *
 * - `naive-day`: the same period of D-1;
 * - `naive-week`: the same period of D-7;
 * - `weekday-rule`: D-7 for Monday, Saturday and Sunday, D-1 otherwise,
 *   the naive benchmark of the day-ahead literature (Nowotarski & Weron
 *   2018; Lago, Marcjasz, De Schutter & Weron 2021).
 */
export type BaselineKind = 'naive-day' | 'naive-week' | 'weekday-rule';

export const BASELINE_KINDS: BaselineKind[] = ['naive-day', 'naive-week', 'weekday-rule'];

/** How many days back the baseline looks for target day `date`. */
export function baselineLag(kind: BaselineKind, date: string): number {
  if (kind === 'naive-day') return 1;
  if (kind === 'naive-week') return 7;
  const weekday = isoWeekday(date);
  return weekday === 1 || weekday >= 6 ? 7 : 1;
}

/** The baseline's forecast for the target day of `view` (NaN where the lag day is unknown). */
export function baselineForecast(kind: BaselineKind, view: DayFrame): DayForecast {
  const d = view.price.length;
  const lag = baselineLag(kind, view.days[d].date);
  const source = view.price[d - lag];
  return { point: source ? Float64Array.from(source) : new Float64Array(view.slots).fill(NaN) };
}

export function baselineModel(kind: BaselineKind): DayAheadModel {
  return {
    name: kind,
    minHistoryDays: kind === 'naive-day' ? 1 : 7,
    fit() {},
    predict: (view) => baselineForecast(kind, view),
  };
}
