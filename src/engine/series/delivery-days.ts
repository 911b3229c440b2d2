import { dayLengthMinutes, toWallClock } from './local-clock';
import type { Series } from './series';

/**
 * A delivery day: a local calendar day of the market zone, holding periods
 * `start .. start + count - 1` of the series. On the day the clocks go
 * forward it has 23 hourly (92 quarter-hour) periods, on the day they go
 * back 25 (100); `expected` says how many a complete day has.
 *
 * `slots[j]` is the clock slot of period start + j: local minutes after
 * midnight divided by the resolution. The two periods of a repeated hour
 * share their slot; the skipped hour has no period for its slots.
 */
export interface DeliveryDay {
  date: string;
  start: number;
  count: number;
  expected: number;
  slots: number[];
}

/** Groups the series' periods into local delivery days (series order). */
export function deliveryDays(series: Series): DeliveryDay[] {
  const days: DeliveryDay[] = [];
  const { times, zone, resolution } = series;
  let current: DeliveryDay | undefined;
  // Offsets only change on the hour: compute wall clocks once per UTC hour.
  let hourKey = NaN, hourDate = '', hourMinutes = 0;
  for (let i = 0; i < times.length; i++) {
    const hourStart = times[i] - (((times[i] % 3_600_000) + 3_600_000) % 3_600_000);
    if (hourStart !== hourKey) {
      const c = toWallClock(hourStart, zone);
      hourKey = hourStart; hourDate = c.date; hourMinutes = c.minutes;
    }
    const minutes = hourMinutes + (times[i] - hourStart) / 60_000;
    if (!current || current.date !== hourDate) {
      current = { date: hourDate, start: i, count: 0, expected: dayLengthMinutes(hourDate, zone) / resolution, slots: [] };
      days.push(current);
    }
    current.slots.push(Math.floor(minutes / resolution));
    current.count++;
  }
  return days;
}

/** Clock slots per day at a resolution: 24, 48 or 96. */
export function slotsPerDay(resolution: number): number {
  return 1440 / resolution;
}

/** True when the day holds all of its periods (not cut by the data's ends). */
export function isComplete(day: DeliveryDay): boolean {
  return day.count === day.expected;
}
