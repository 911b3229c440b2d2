import { checkZone, dayLengthMinutes } from './local-clock';
import { offsetLookup } from './zone-offsets';
import type { Series } from './series';

const DAY_MS = 86_400_000;

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
  checkZone(zone);
  const offsetAt = offsetLookup(zone);
  let current: DeliveryDay | undefined;
  let dayNumber = NaN, date = '';
  for (let i = 0; i < times.length; i++) {
    // the local wall clock of the period's own start, read as a UTC date and time
    const local = times[i] + offsetAt(times[i]) * 60_000;
    const n = Math.floor(local / DAY_MS);
    if (n !== dayNumber) { dayNumber = n; date = new Date(n * DAY_MS).toISOString().slice(0, 10); }
    const minutes = (local - n * DAY_MS) / 60_000;
    if (!current || current.date !== date) {
      current = { date, start: i, count: 0, expected: dayLengthMinutes(date, zone) / resolution, slots: [] };
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
