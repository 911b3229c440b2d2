import { InputError, serialToWallClock, timestampReader, type Where } from '../../engine';
import type { CellValue } from '../../host/workbook-port';

/**
 * Days between serial 0 of the 1904 date system (1904-01-01) and serial 0 of
 * the 1900 system (1899-12-30 in practice): a 1904 serial plus 1462 is the
 * same day as a 1900 serial (ECMA-376 Part 1, 18.17.4.1).
 */
export const DATE_1904_OFFSET = 1462;

const NUMERIC = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** Reads one timestamp cell; blank cells are the caller's business. */
export type TimeReader = (value: CellValue, where: Where) => number;

/**
 * A reader that turns timestamp cells into UTC milliseconds, in row order:
 *
 * - a number (or numeric text) is a spreadsheet serial: the wall-clock time
 *   in the market zone `zone`, in the workbook's date system;
 * - other text is ISO 8601 with a UTC offset or `Z`, or local wall-clock
 *   time of the zone without one (`2025-10-26 02:00`), read by the engine's
 *   one timestamp reader (series/timestamp-reader.ts), as data files and the
 *   cell functions read it.
 *
 * A serial or offset-free text names a wall-clock time, and on the day the
 * clocks go back one hour of wall time happens twice: the first occurrence
 * is the earlier instant, a repeat the later one. A wall time inside the
 * skipped spring hour is refused.
 *
 * @param zone IANA time zone of the market, e.g. Europe/Berlin
 * @param dateSystem the workbook's date system
 * @returns a stateful reader; make a new one per read of a range
 * @throws (the reader) InputError naming the row for a boolean, a time that
 *   does not exist, a serial out of range or text that is no timestamp
 * @example timeReader('Europe/Berlin', '1900')(45658, {}) // 1735686000000 (2025-01-01T00:00+01:00)
 * Source: ECMA-376 Part 1, 18.17.4 (serial dates); IANA tz database (zone rules).
 */
export function timeReader(zone: string, dateSystem: '1900' | '1904'): TimeReader {
  const reader = timestampReader(zone);
  return (value, where) => {
    if (typeof value === 'boolean') throw new InputError(`${value} is not a timestamp`, where);
    const text = typeof value === 'number' ? String(value) : String(value ?? '').trim();
    if (typeof value === 'number' || NUMERIC.test(text)) {
      const serial = Number(text) + (dateSystem === '1904' ? DATE_1904_OFFSET : 0);
      try {
        return reader.wall(serialToWallClock(serial), where);
      } catch (error) {
        if (error instanceof InputError) throw new InputError(error.message, where);
        throw error;
      }
    }
    return reader.text(text, where);
  };
}
