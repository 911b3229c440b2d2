/**
 * The few moment-timezone calls that date-holidays' rule reader makes,
 * answered with luxon (the engine's one date-time library), so the add-in's
 * browser build carries neither moment nor moment-timezone's zone tables
 * (webpack.config.js puts this module in their place; the command line in
 * Node keeps the real package). The calls, from caldate 2.0 (CalDate.js) and
 * date-holidays-parser 3.4 (Equinox.js):
 *
 * - `moment.tz('YYYY-MM-DD HH:mm:ss', zone).format()`: a wall-clock time of
 *   the zone as ISO 8601 with its offset (a time the spring change skips
 *   moves forward by the gap, as moment does);
 * - `moment.tz(date, zone)` then `.year() .month() .date() .hours() .minutes()
 *   .seconds()`: an instant's wall clock in the zone (month 0-based);
 * - `moment(isoString).tz(zone)` and `.utcOffset('+08:00')`, then `.month()
 *   .date()`.
 *
 * tests/engine/calendar/moment-timezone-browser.test.ts compares it with
 * moment-timezone itself.
 */
import { DateTime, FixedOffsetZone } from 'luxon';

class WallClock {
  constructor(private readonly at: DateTime) {}
  year(): number { return this.at.year; }
  month(): number { return this.at.month - 1; }
  date(): number { return this.at.day; }
  hours(): number { return this.at.hour; }
  minutes(): number { return this.at.minute; }
  seconds(): number { return this.at.second; }
  format(): string { return this.at.toISO({ suppressMilliseconds: true, includeOffset: true }) ?? 'Invalid date'; }
  tz(zone: string): WallClock { return new WallClock(this.at.setZone(zone)); }
  utcOffset(offset: string): WallClock {
    const zone = FixedOffsetZone.parseSpecifier(`UTC${offset}`);
    return new WallClock(zone ? this.at.setZone(zone) : DateTime.invalid('unknown offset'));
  }
}

function instant(input: string | Date): DateTime {
  return typeof input === 'string' ? DateTime.fromISO(input, { zone: 'utc' }) : DateTime.fromJSDate(input, { zone: 'utc' });
}

function moment(input: string | Date): WallClock {
  return new WallClock(instant(input));
}

moment.tz = (input: string | Date, zone: string): WallClock =>
  typeof input === 'string' ? new WallClock(wallClockIn(input.replace(' ', 'T'), zone)) : new WallClock(DateTime.fromJSDate(input, { zone }));

/**
 * A wall-clock time of a zone as an instant. A time the autumn change
 * repeats is its first occurrence (summer time), as moment-timezone reads it;
 * luxon alone would take the second. A skipped time moves forward by the gap
 * in both.
 */
function wallClockIn(iso: string, zone: string): DateTime {
  const at = DateTime.fromISO(iso, { zone });
  if (!at.isValid) return at;
  const earlier = at.minus({ hours: 3 });
  if (earlier.offset === at.offset) return at;
  const wall = DateTime.fromISO(iso, { zone: 'utc' }).toMillis();
  // the same wall clock read with the offset before the change, when that offset still holds then
  const first = DateTime.fromMillis(wall - earlier.offset * 60_000, { zone });
  return first.toMillis() < at.toMillis() && first.offset === earlier.offset ? first : at;
}

export default moment;
