import { DateTime, IANAZone } from 'luxon';
import { InputError } from '../errors';
import { quoteCell } from './quote-cell';
import type { WallClock } from './serial-date';

/**
 * Local wall-clock views of UTC instants in a market's time zone (IANA tz
 * database rules, e.g. EU summer time per Directive 2000/84/EC).
 */

/** @throws InputError when `zone` is not an IANA time zone name. */
export function checkZone(zone: string): void {
  if (!IANAZone.isValidZone(zone)) {
    throw new InputError(`${quoteCell(zone)} is not an IANA time zone name such as Europe/Berlin`);
  }
}

/** Local date (YYYY-MM-DD) and minutes after local midnight of a UTC instant. */
export function toWallClock(ms: number, zone: string): WallClock {
  const t = DateTime.fromMillis(ms, { zone });
  return { date: t.toISODate() as string, minutes: t.hour * 60 + t.minute };
}

/** UTC instant at which local day `date` starts (its first delivery period). */
export function dayStartUtc(date: string, zone: string): number {
  return DateTime.fromISO(date, { zone }).startOf('day').toMillis();
}

/**
 * Length of local day `date` in minutes: 1440, or 1380 and 1500 on the EU
 * and US change days (other zones shift by other amounts, e.g. Lord Howe's
 * 30 minutes). Measured between the starts of the day and the next one, so
 * a day whose midnight the clocks skip (it starts at 01:00) counts right.
 */
export function dayLengthMinutes(date: string, zone: string): number {
  const start = DateTime.fromISO(date, { zone }).startOf('day');
  const next = start.plus({ days: 1 }).startOf('day');
  return (next.toMillis() - start.toMillis()) / 60_000;
}

/**
 * UTC instant of a local wall-clock time. On the day the clocks go back the
 * repeated hour has two instants: `later` picks the second one.
 * A time inside the skipped hour (spring forward) does not exist: refused.
 */
export function wallClockToUtc(wall: WallClock, zone: string, later = false): number {
  const { date, minutes } = wall;
  const guess = DateTime.fromObject(
    { year: +date.slice(0, 4), month: +date.slice(5, 7), day: +date.slice(8, 10), hour: Math.floor(minutes / 60), minute: minutes % 60 },
    { zone },
  ).toMillis();
  // Offsets change by at most an hour here: the true instants lie within one hour of the guess.
  const hits = [guess - 3_600_000, guess, guess + 3_600_000].filter((ms) => {
    const c = toWallClock(ms, zone);
    return c.date === date && c.minutes === minutes;
  });
  if (hits.length === 0) {
    throw new InputError(`${date} ${hhmm(minutes)} does not exist in ${zone} (the clocks skip it)`);
  }
  return later ? hits[hits.length - 1] : hits[0];
}

export function hhmm(minutes: number): string {
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}
