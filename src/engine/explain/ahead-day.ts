import { nextDayFrame } from '../models/forecast-ahead';
import type { DayAheadModel } from '../models/model';
import { frameBefore, type DayFrame } from '../series/day-frame';
import { dayMatrix } from '../series/day-matrix';
import type { Series } from '../series/series';

/** The day an explanation is about, as `forecast` would forecast it. */
export interface AheadDay {
  /** the frame the model reads (inputFrame: unknown values filled from earlier days) */
  frame: DayFrame;
  /** index of the next delivery day after the last known price */
  d: number;
  /** the known prices of day `k` on its clock slots, unfilled (NaN where unknown) */
  actual(k: number): Float64Array;
}

/**
 * Finds the next delivery day exactly as forecastAhead does, and forecasts
 * it once through the model's own `predict`, so an input the forecast
 * would refuse (a missing or wild driver, prices out of range) is refused
 * here with the same message.
 *
 * @throws InputError when the next day cannot be forecast
 */
export function aheadDay(model: DayAheadModel, series: Series, drivers: string[]): AheadDay {
  const { full, frame, first } = nextDayFrame(series, drivers);
  model.predict(frameBefore(frame, first));
  return { frame, d: first, actual: (k) => dayMatrix(full.price, [frame.days[k]], frame.slots)[0] };
}
