import { DateTime, IANAZone } from 'luxon';
import { InputError } from '../errors';
import { dayNumber } from '../calendar/weekday';

/**
 * The delivery periods of one local calendar day in a market's time zone.
 *
 * A delivery day runs from local midnight to the next local midnight, so it
 * has 23, 24 or 25 hours (92, 96 or 100 quarter-hours) on clock-change days.
 * For each period: its start as a UTC instant, the local UTC offset then, and
 * the local clock time in minutes after midnight (on the day the clocks go
 * back the repeated hour appears twice; on the day they go forward one hour
 * is missing).
 */
export interface DayPeriods {
  /** local calendar date `YYYY-MM-DD` */
  date: string;
  /** UTC ms at which each period starts */
  start: number[];
  /** local UTC offset in minutes at each period start */
  offset: number[];
  /** local clock time at each period start, minutes after midnight (0 … 1439) */
  clock: number[];
}

const HOUR_MS = 3_600_000;

/**
 * Delivery periods of every local day from `first` to `last` (both included).
 *
 * Walks the days in UTC and asks the time-zone rules once per day (twice on
 * a clock-change day), so years of quarter-hours take milliseconds.
 *
 * @param first - first local calendar date `YYYY-MM-DD`
 * @param last - last local calendar date `YYYY-MM-DD`
 * @param zone - IANA time zone, e.g. `Europe/Berlin`
 * @param resolution - period length in minutes: 15, 30 or 60
 * @returns one entry per day, in delivery order
 * @throws InputError when `zone` is not an IANA time zone or a date is not real
 * @example dayPeriods('2025-03-30', '2025-03-30', 'Europe/Berlin', 60)[0].start.length // 23
 * @see https://www.iana.org/time-zones (tz database rules, e.g. EU summer time, Directive 2000/84/EC)
 */
export function dayPeriods(first: string, last: string, zone: string, resolution: 15 | 30 | 60): DayPeriods[] {
  const tz = IANAZone.create(zone);
  if (!tz.isValid) throw new InputError(`"${zone}" is not an IANA time zone name such as Europe/Berlin`);
  const days = dayNumber(last) - dayNumber(first) + 1;
  const step = resolution * 60_000;
  let dayStart = DateTime.fromISO(first, { zone: tz }).startOf('day').toMillis();
  let dayOffset = tz.offset(dayStart);
  let date = first;
  const out: DayPeriods[] = [];
  for (let d = 0; d < days; d++) {
    // Next local midnight: 24 h later, corrected by the offset change if the clocks moved.
    let next = dayStart + 24 * HOUR_MS;
    let nextOffset = tz.offset(next);
    if (nextOffset !== dayOffset) {
      next -= (nextOffset - dayOffset) * 60_000;
      nextOffset = tz.offset(next);
    }
    const steady = nextOffset === dayOffset && tz.offset(next - 1) === dayOffset;
    const start: number[] = [];
    const offset: number[] = [];
    const clock: number[] = [];
    const localMidnight = dayStart + dayOffset * 60_000;
    for (let t = dayStart; t < next; t += step) {
      const off = steady ? dayOffset : tz.offset(t);
      start.push(t);
      offset.push(off);
      clock.push(Math.round((t + off * 60_000 - localMidnight) / 60_000));
    }
    out.push({ date, start, offset, clock });
    dayStart = next;
    dayOffset = nextOffset;
    date = nextDate(date);
  }
  return out;
}

function nextDate(date: string): string {
  return new Date(Date.UTC(+date.slice(0, 4), +date.slice(5, 7) - 1, +date.slice(8, 10) + 1)).toISOString().slice(0, 10);
}
