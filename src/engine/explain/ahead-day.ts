import { InputError } from '../errors';
import { forecastAhead, withNextDay } from '../models/forecast-ahead';
import type { DayAheadModel } from '../models/model';
import { dayFrame, type DayFrame } from '../series/day-frame';
import { inputFrame } from '../series/input-frame';
import type { Series } from '../series/series';

/** The day an explanation is about, as `forecast` would forecast it. */
export interface AheadDay {
  /** the frame the model reads (inputFrame: unknown values filled from earlier days) */
  frame: DayFrame;
  /** the same days unfilled, for actual prices */
  raw: DayFrame;
  /** index of the next delivery day after the last known price */
  d: number;
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
  const { days } = forecastAhead(model, series, drivers);
  const full = drivers.length === 0 ? withNextDay(series) : series;
  const frame = inputFrame(full);
  const d = frame.price.length;
  if (frame.days[d]?.date !== days[0]) throw new InputError(`cannot find the delivery day ${days[0]} in the data`);
  return { frame, raw: dayFrame(full), d };
}
