/**
 * Calendar-date arithmetic on plain `YYYY-MM-DD` strings.
 *
 * A delivery day is a local calendar day; its weekday and its neighbours
 * follow from the date alone, so no time zone (and no daylight-saving rule)
 * is involved here. `Date.UTC` is used only as a proleptic Gregorian day
 * counter.
 *
 * Source: ISO 8601-1:2019, 4.3.2.2 (weekday numbers 1 = Monday … 7 = Sunday).
 */
import { InputError } from '../errors';

const DAY_MS = 86_400_000;
const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Days since 1970-01-01 of a calendar date, after checking it is a real date.
 *
 * @param date - calendar date `YYYY-MM-DD`
 * @returns whole days since 1970-01-01 (negative before)
 * @throws InputError when `date` is not a real `YYYY-MM-DD` date
 * @example dayNumber('1970-01-02') // 1
 */
export function dayNumber(date: string): number {
  const m = DATE_PATTERN.exec(date);
  if (m) {
    const y = Number(m[1]);
    const mo = Number(m[2]);
    const d = Number(m[3]);
    const ms = Date.UTC(y, mo - 1, d);
    const back = new Date(ms);
    // Date.UTC maps years 0–99 to 1900–1999; reject those along with overflowed days.
    if (back.getUTCFullYear() === y && back.getUTCMonth() === mo - 1 && back.getUTCDate() === d) {
      return Math.round(ms / DAY_MS);
    }
  }
  throw new InputError(`"${date}" is not a calendar date; write it as YYYY-MM-DD, e.g. 2025-03-30`);
}

/**
 * Calendar date `YYYY-MM-DD` of a day number (inverse of {@link dayNumber}).
 *
 * @param day - whole days since 1970-01-01
 * @returns the date as `YYYY-MM-DD`
 * @example dateOfDayNumber(1) // '1970-01-02'
 */
export function dateOfDayNumber(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/**
 * ISO weekday of a calendar date: 1 = Monday … 7 = Sunday.
 *
 * @param date - calendar date `YYYY-MM-DD` (local to the market; no time zone involved)
 * @returns 1..7
 * @throws InputError when `date` is not a real `YYYY-MM-DD` date
 * @example isoWeekday('2025-03-30') // 7 (a Sunday)
 * @see https://en.wikipedia.org/wiki/ISO_week_date (ISO 8601 weekday numbering)
 */
export function isoWeekday(date: string): number {
  // 1970-01-01 was a Thursday (ISO weekday 4).
  const n = dayNumber(date);
  return ((((n + 3) % 7) + 7) % 7) + 1;
}

/**
 * The calendar date `n` days after `date` (before it when `n` is negative).
 *
 * @param date - calendar date `YYYY-MM-DD`
 * @param n - whole number of days
 * @returns the shifted date `YYYY-MM-DD`
 * @throws InputError when `date` is not a real date or `n` is not a whole number
 * @example addDays('2024-02-28', 1) // '2024-02-29'
 */
export function addDays(date: string, n: number): string {
  if (!Number.isInteger(n)) {
    throw new InputError(`addDays needs a whole number of days, got ${n}`);
  }
  return dateOfDayNumber(dayNumber(date) + n);
}
