import { InputError, type Where } from '../errors';
import { quoteCell } from './quote-cell';

// Date, time and a mandatory offset: without one a local time is ambiguous
// on the day the clocks go back, so we refuse rather than guess.
const ISO = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,9}))?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)$/i;

/**
 * Parses an ISO 8601 timestamp with a UTC offset or `Z` into UTC milliseconds.
 *
 * @throws InputError when the text is not such a timestamp.
 * @example parseTimestamp('2025-03-30T03:00:00+02:00') // 1743296400000
 * Source: ISO 8601-1:2019, 5.4 (date and time of day with UTC offset).
 */
export function parseTimestamp(text: string, where?: Where): number {
  const m = ISO.exec(text.trim());
  if (!m) {
    throw new InputError(
      `${quoteCell(text)} is not a timestamp with a UTC offset; write it like 2025-03-30T03:00:00+02:00 or 2025-03-30T01:00:00Z`,
      where,
    );
  }
  const [, y, mo, d, h, mi, s = '0', frac = '0', off] = m;
  const year = +y, month = +mo, day = +d, hour = +h, minute = +mi, second = +s;
  const fields: [number, number, number, string][] = [
    [month, 1, 12, 'month'], [day, 1, daysInMonth(year, month), 'day'],
    [hour, 0, 23, 'hour'], [minute, 0, 59, 'minute'], [second, 0, 59, 'second'],
  ];
  for (const [v, lo, hi, name] of fields) {
    if (v < lo || v > hi) throw new InputError(`${quoteCell(text)} has ${name} ${v} out of range`, where);
  }
  const offset = offsetMinutes(off);
  if (Math.abs(offset) >= 24 * 60 || (off.length > 3 && +off.slice(-2) > 59)) {
    throw new InputError(`${quoteCell(text)} has UTC offset ${off} out of range (hours 00-23, minutes 00-59)`, where);
  }
  const ms = Math.round(Number(`0.${frac}`) * 1000);
  // Date.UTC reads years 0-99 as 1900-1999: set the full year separately
  const utc = new Date(Date.UTC(2000, month - 1, day, hour, minute, second));
  utc.setUTCFullYear(year, month - 1, day);
  return utc.getTime() + ms - offset * 60_000;
}

function offsetMinutes(off: string): number {
  if (off.toUpperCase() === 'Z') return 0;
  const sign = off[0] === '-' ? -1 : 1;
  const digits = off.slice(1).replace(':', '');
  const hours = +digits.slice(0, 2);
  const minutes = digits.length > 2 ? +digits.slice(2, 4) : 0;
  return sign * (hours * 60 + minutes);
}

function daysInMonth(year: number, month: number): number {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return month === 2 ? (leap ? 29 : 28) : [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
}
