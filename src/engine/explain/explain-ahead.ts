import { addDays } from '../calendar/weekday';
import { InputError } from '../errors';
import type { DayAheadModel } from '../models/model';
import { frameBefore } from '../series/day-frame';
import type { Series } from '../series/series';
import { aheadDay } from './ahead-day';
import { dayContributions, mean } from './contributions';
import { groupedModelOf } from './grouped-model-of';

export const REFERENCE_CHOICES = ['d-1', 'd-7'] as const;
export type ReferenceChoice = (typeof REFERENCE_CHOICES)[number];

/** One group's share of the change. */
export interface Contribution {
  group: string;
  /** share of the change of the day's mean forecast (price units) */
  value: number;
  /** share of the change in each clock slot of the day */
  perSlot: number[];
}

/** Why the next day's forecast differs from the model's forecast of a reference day. */
export interface Explanation {
  day: string;
  referenceDay: string;
  against: ReferenceChoice;
  /** mean of the forecast of `day` over its clock slots */
  forecastMean: number;
  /** mean of the model's forecast of the reference day, from that day's own inputs */
  referenceForecastMean: number;
  /** mean of the reference day's known prices over its clock slots (NaN when none is known) */
  referenceActualMean: number;
  /** referenceForecastMean − referenceActualMean: the model's error on the reference day */
  referenceError: number;
  /** forecastMean − referenceForecastMean; the contributions add up to it */
  change: number;
  /** one per group, in the model's group order */
  contributions: Contribution[];
  /** the forecast of `day` and of the reference day, per clock slot */
  forecast: number[];
  reference: number[];
}

/**
 * Explains the forecast of the delivery day after the last known price
 * (the day `forecast` would forecast) against the model's own forecast of
 * D-1 or D-7: contributions.ts splits the change into exact Shapley values
 * per input group. Means are over the day's clock slots (day-matrix.ts),
 * so D and R compare slot by slot even across a clock change.
 *
 * @example explainAhead(learner, series, ['load_forecast'], 'd-1').contributions // [{ group: 'price_lags', value: 3.1, ... }, ...]
 * @throws InputError for a model that cannot be explained or a day that cannot be forecast
 */
export function explainAhead(model: DayAheadModel, series: Series, drivers: string[], against: ReferenceChoice = 'd-1'): Explanation {
  if (!(REFERENCE_CHOICES as readonly string[]).includes(against)) throw new InputError(`against must be d-1 or d-7, got "${against}"`);
  const grouped = groupedModelOf(model);
  const { frame, d, actual: actualOf } = aheadDay(model, series, drivers);
  const r = d - (against === 'd-7' ? 7 : 1);
  const day = frame.days[d].date;
  const referenceDay = addDays(day, against === 'd-7' ? -7 : -1);
  // the reference day's inputs pass the same checks as a forecast's (a mistyped driver there would skew every contribution)
  if (r >= 0 && grouped.inputsOf(frame, r)) model.predict(frameBefore(frame, r));
  const found = r >= 0 ? dayContributions(grouped, frame, d, r) : undefined;
  if (!found) {
    throw new InputError(`cannot explain ${day} against ${referenceDay}: the reference day has too little price history before it to be forecast itself; give a longer history or compare with d-1`);
  }
  if (![...found.forecast, ...found.reference, ...found.contributions].every(Number.isFinite)) {
    throw new InputError(`cannot explain ${day} against ${referenceDay}: the model's forecast of a mix of the two days' inputs is not a finite number; check the inputs of both days`);
  }
  const actual = Array.from(actualOf(r)).filter((v) => !Number.isNaN(v));
  const forecastMean = mean(found.forecast);
  const referenceForecastMean = mean(found.reference);
  const referenceActualMean = actual.length ? mean(actual) : NaN;
  return {
    day, referenceDay, against, forecastMean, referenceForecastMean, referenceActualMean,
    referenceError: referenceForecastMean - referenceActualMean,
    change: forecastMean - referenceForecastMean,
    contributions: found.groups.map((group, g) => ({ group, value: found.contributions[g], perSlot: Array.from(found.perSlot[g]) })),
    forecast: Array.from(found.forecast),
    reference: Array.from(found.reference),
  };
}

/** The contributions, largest magnitude first (ties in group order). */
export function byMagnitude(contributions: Contribution[]): Contribution[] {
  return contributions.map((c, i) => ({ c, i })).sort((a, b) => Math.abs(b.c.value) - Math.abs(a.c.value) || a.i - b.i).map((e) => e.c);
}
