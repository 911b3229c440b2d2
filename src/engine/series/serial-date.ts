import { InputError } from '../errors';

/**
 * Spreadsheet serial dates in the 1900 date system (ECMA-376 Part 1, 18.17.4.1).
 *
 * Serial 1 is 1900-01-01. The system counts a 29 February 1900 that never
 * existed (serial 60), kept for compatibility with early spreadsheets, so
 * from serial 61 (1900-03-01) on, the day is serial - 25569 days from
 * 1970-01-01. Serial 60 itself names no real day and is refused.
 * The fraction is the wall-clock time of day, in the workbook's own zone.
 *
 * @example serialToWallClock(45658) // { date: '2025-01-01', minutes: 0 }
 */
export interface WallClock {
  /** local calendar date, YYYY-MM-DD */
  date: string;
  /** minutes after local midnight, rounded to the whole minute */
  minutes: number;
}

const DAY_MS = 86_400_000;
const UNIX_EPOCH_SERIAL = 25569; // 1970-01-01 in the 1900 system
const LAST_SERIAL = 2_958_466; // 10000-01-01, the first serial past the system's range

export function serialToWallClock(serial: number): WallClock {
  if (!Number.isFinite(serial) || serial < 1 || serial >= LAST_SERIAL) {
    throw new InputError(`${serial} is not a spreadsheet date serial between 1 (1900-01-01) and 9999-12-31`);
  }
  if (Math.floor(serial) === 60) {
    throw new InputError('serial 60 is the 29 February 1900 that never existed; correct the date');
  }
  // Serials before the phantom day are one day "early" against the real calendar.
  const shifted = serial < 60 ? serial + 1 : serial;
  let whole = Math.floor(shifted);
  let minutes = Math.round((shifted - whole) * 1440);
  if (minutes === 1440) { whole += 1; minutes = 0; }
  if (whole >= LAST_SERIAL) {
    throw new InputError(`${serial} rounds to 10000-01-01, past the last spreadsheet date 9999-12-31`);
  }
  const date = new Date((whole - UNIX_EPOCH_SERIAL) * DAY_MS).toISOString().slice(0, 10);
  return { date, minutes };
}

/** Inverse of serialToWallClock for dates from 1900-03-01 on. */
export function wallClockToSerial({ date, minutes }: WallClock): number {
  const days = Date.parse(`${date}T00:00:00Z`) / DAY_MS + UNIX_EPOCH_SERIAL;
  return days + minutes / 1440;
}
