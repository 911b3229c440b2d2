import {
  InputError, serialToWallClock, timestampReader, type WallClock, type Where,
} from '../engine';
import { isBlank } from './cells';

/**
 * Timestamps of delivery periods as cells give them, turned into UTC instants
 * by the engine's one timestamp reader (timestamp-reader.ts), the same that
 * reads data files:
 *
 * - a number is a spreadsheet date serial (the workbook's date system; the
 *   1904 system is shifted by 1462 days onto the 1900 one, ECMA-376 Part 1,
 *   §18.17.4.1) and reads as wall-clock time in the market's zone;
 * - text with a UTC offset (`2025-03-30T03:00:00+02:00`, ISO 8601) is an
 *   exact instant; an offset other than UTC's must be the zone's own at that
 *   instant, or the timestamp belongs to another market and is refused;
 * - text without an offset (`2025-03-30 03:00`, `2025-03-30`) is wall-clock
 *   time in the zone, like a serial;
 * - an empty cell gives `undefined`.
 *
 * Wall-clock times repeat on the day the clocks go back: the first time a
 * repeated time appears in the list it is the earlier instant, the second
 * time the later one (rows are periods in time order). A wall-clock time in
 * the hour the clocks skip does not exist and is refused.
 *
 * @example readTimes([45658, 45658 + 1 / 24], 'Europe/Berlin', 'times') // [1735686000000, 1735689600000]
 */
export type DateSystem = '1900' | '1904';

const DAYS_1904_TO_1900 = 1462;

export function readTimes(cells: unknown[], zone: string, what: string, dateSystem: DateSystem = '1900', firstRow = 1): (number | undefined)[] {
  const reader = timestampReader(zone, { zoneOffsetsOnly: true });
  return cells.map((v, i) => {
    const where: Where = { column: what, row: i + firstRow };
    if (isBlank(v)) return undefined;
    if (typeof v === 'number') return reader.wall(serialWall(v, dateSystem, where), where);
    if (typeof v === 'string') return reader.text(v, where);
    if (typeof v === 'boolean') throw new InputError(`${v ? 'TRUE' : 'FALSE'} is not a timestamp`, where);
    throw new InputError('holds an error or a value that is not a timestamp', where);
  });
}

/** The local calendar date of a date cell (serial or text), time of day ignored. */
export function readDate(v: unknown, what: string, dateSystem: DateSystem = '1900'): string {
  const where: Where = { column: what };
  if (typeof v === 'number') return serialWall(Math.floor(v), dateSystem, where).date;
  if (typeof v === 'string') {
    const m = /^(\d{4}-\d{2}-\d{2})(?:[T ].*)?$/.exec(v.trim());
    if (m) return m[1];
  }
  throw new InputError(`${isBlank(v) ? 'is empty' : `"${clip(String(v))}" is not a date`}; give a date cell or text like 2025-10-03`, where);
}

function serialWall(serial: number, dateSystem: DateSystem, where: Where): WallClock {
  try {
    return serialToWallClock(dateSystem === '1904' ? serial + DAYS_1904_TO_1900 : serial);
  } catch (err) {
    throw relocate(err, where);
  }
}

function relocate(err: unknown, where: Where): unknown {
  return err instanceof InputError && Object.keys(err.where).length === 0 ? new InputError(err.message, where) : err;
}

function clip(s: string): string {
  return s.length > 40 ? `${s.slice(0, 40)}…` : s;
}
