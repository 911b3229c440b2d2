import { InputError } from '../errors';
import { dayMatrix } from './day-matrix';
import { deliveryDays, slotsPerDay, type DeliveryDay } from './delivery-days';
import type { Resolution, Series } from './series';

/**
 * What a day-ahead model sees: the series as days × clock slots.
 *
 * `price` has one row per day whose prices the model may know; `drivers`
 * (known-ahead forecasts) has rows up to and including the target day. A
 * model always forecasts day `price.length`, the day right after the last
 * price row, so a frame cut with `frameBefore` cannot leak the future: the
 * rows a model must not see are simply not in it.
 */
export interface DayFrame {
  zone: string;
  resolution: Resolution;
  slots: number;
  days: DeliveryDay[];
  price: Float64Array[];
  drivers: Record<string, Float64Array[]>;
}

export function dayFrame(series: Series): DayFrame {
  const days = deliveryDays(series);
  const slots = slotsPerDay(series.resolution);
  const drivers: Record<string, Float64Array[]> = {};
  for (const [name, values] of Object.entries(series.drivers)) drivers[name] = dayMatrix(values, days, slots);
  return { zone: series.zone, resolution: series.resolution, slots, days, price: dayMatrix(series.price, days, slots), drivers };
}

/** The view for forecasting day `d`: prices of days before d, drivers up to d. */
export function frameBefore(frame: DayFrame, d: number): DayFrame {
  if (d < 0 || d >= frame.days.length) throw new InputError(`day index ${d} is outside the data`);
  const drivers: Record<string, Float64Array[]> = {};
  for (const [name, rows] of Object.entries(frame.drivers)) drivers[name] = rows.slice(0, d + 1);
  return { ...frame, days: frame.days.slice(0, d + 1), price: frame.price.slice(0, d), drivers };
}

/** Index of the target day of a view: the day right after its last price row. */
export function targetDay(view: DayFrame): number {
  return view.price.length;
}

/** Index of the first day on or after `date` (YYYY-MM-DD), or -1. */
export function dayIndexOf(frame: DayFrame, date: string): number {
  return frame.days.findIndex((day) => day.date >= date);
}
