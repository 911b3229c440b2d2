import type { DayAheadModel } from '../models/model';
import type { DayFrame } from '../series/day-frame';
import type { Series } from '../series/series';
import { aheadDay } from './ahead-day';
import { mean } from './contributions';
import type { GroupedModel } from './grouped-model';
import { groupedModelOf } from './grouped-model-of';

/** How the forecast of one day moves per unit of one driver. */
export interface DriverSensitivity {
  driver: string;
  /** the half-width of the central difference, in the driver's unit */
  step: number;
  /** forecast change per unit of the driver, per clock slot, when the driver moves by that unit on every period of the day */
  perSlot: number[];
  /** the same for the day's mean forecast */
  mean: number;
}

/** Relative size of the finite-difference step: small against the values, large against rounding. */
const RELATIVE_STEP = 1e-3;

/**
 * Per driver: the change of day d's forecast per unit of the driver, by a
 * central difference (f(x + h) − f(x − h)) / 2h with the driver shifted by
 * h on every period of day d (h = 0.1 % of the day's mean absolute value,
 * at least 0.001). The shift reaches every input made from that day's
 * driver values (the driver's own target-day profile and, for load, wind
 * and solar, the residual load). Source: the central difference quotient,
 * e.g. Press et al., Numerical Recipes (3rd ed.), section 5.7.
 * A driver whose shifted day gives unknown inputs is left out.
 */
export function driverSensitivities<I>(model: GroupedModel<I>, frame: DayFrame, d: number, drivers: string[]): DriverSensitivity[] {
  const out: DriverSensitivity[] = [];
  for (const driver of drivers) {
    const row = frame.drivers[driver]?.[d];
    if (!row) continue;
    let size = 0;
    for (const v of row) size += Math.abs(v) / row.length;
    const h = Math.max(RELATIVE_STEP * size, RELATIVE_STEP);
    const up = model.inputsOf(shifted(frame, d, driver, h), d);
    const down = model.inputsOf(shifted(frame, d, driver, -h), d);
    if (!up || !down) continue;
    const fu = model.forecast(up), fd = model.forecast(down);
    const perSlot = Array.from(fu, (v, s) => (v - fd[s]) / (2 * h));
    out.push({ driver, step: h, perSlot, mean: mean(perSlot) });
  }
  return out;
}

/** Sensitivities for the delivery day after the last known price (the day `forecast` forecasts). */
export function sensitivityAhead(model: DayAheadModel, series: Series, drivers: string[]): { day: string; drivers: DriverSensitivity[] } {
  const grouped = groupedModelOf(model);
  const { frame, d } = aheadDay(model, series, drivers);
  return { day: frame.days[d].date, drivers: driverSensitivities(grouped, frame, d, drivers) };
}

/**
 * The frame with one driver moved by `h` on day d. Day d gets a fresh day
 * object: a model may cache a day's inputs by that object (training-days.ts).
 */
function shifted(frame: DayFrame, d: number, driver: string, h: number): DayFrame {
  const rows = frame.drivers[driver].slice();
  rows[d] = rows[d].map((v) => v + h);
  const days = frame.days.slice();
  days[d] = { ...days[d] };
  return { ...frame, days, drivers: { ...frame.drivers, [driver]: rows } };
}
