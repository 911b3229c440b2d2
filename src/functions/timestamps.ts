import {
  dayNumber, InputError, parseTimestamp, serialToWallClock, toWallClock, wallClockToUtc,
  type WallClock, type Where,
} from '../engine';
import { isBlank } from './cells';

/**
 * Timestamps of delivery periods as cells give them, turned into UTC instants:
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
const WITH_OFFSET = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)$/i;
const LOCAL = /^(\d{4}-\d{2}-\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?$/;

export function readTimes(cells: unknown[], zone: string, what: string, dateSystem: DateSystem = '1900', firstRow = 1): (number | undefined)[] {
  const seen = new Set<string>();
  const offsets = new Map<string, number | null>();
  return cells.map((v, i) => {
    const where: Where = { column: what, row: i + firstRow };
    if (isBlank(v)) return undefined;
    if (typeof v === 'number') return fromWall(serialWall(v, dateSystem, where), zone, seen, offsets, where);
    if (typeof v === 'string') {
      const text = v.trim();
      if (WITH_OFFSET.test(text)) return exactInstant(text, zone, where);
      const m = LOCAL.exec(text);
      if (m) {
        if (m[4] !== undefined && m[4] !== '00') throw new InputError(`"${text}" has seconds; delivery periods start on whole minutes`, where);
        const minutes = m[2] === undefined ? 0 : Number(m[2]) * 60 + Number(m[3]);
        if (minutes >= 1440 || Number(m[3] ?? 0) > 59) throw new InputError(`"${text}" is not a time of day`, where);
        relocating(where, () => dayNumber(m[1]));
        return fromWall({ date: m[1], minutes }, zone, seen, offsets, where);
      }
      throw new InputError(
        `"${clip(text)}" is not a timestamp; use a date-time cell or text like 2025-03-30T03:00:00+02:00`,
        where,
      );
    }
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

function fromWall(wall: WallClock, zone: string, seen: Set<string>, offsets: Map<string, number | null>, where: Where): number {
  // fast path: on a day without a clock change the zone's offset is one number
  const offset = dayOffset(wall.date, zone, offsets);
  if (offset !== null) return Date.parse(`${wall.date}T00:00:00Z`) + wall.minutes * 60_000 - offset;
  try {
    const early = wallClockToUtc(wall, zone, false);
    const late = wallClockToUtc(wall, zone, true);
    if (early === late) return early;
    const key = `${wall.date} ${wall.minutes}`;
    const second = seen.has(key);
    seen.add(key);
    return second ? late : early;
  } catch (err) {
    throw relocate(err, where);
  }
}

/**
 * The zone's UTC offset (ms) throughout a local date, or null when it changes
 * on or near that date (then the exact, slower conversion decides). The
 * offset is taken 14 hours before the date's wall-clock midnight and 38
 * hours after it, which brackets the whole local day for any offset.
 */
function dayOffset(date: string, zone: string, cache: Map<string, number | null>): number | null {
  let hit = cache.get(date);
  if (hit === undefined) {
    const midnight = Date.parse(`${date}T00:00:00Z`);
    const at = (ms: number) => {
      const c = toWallClock(ms, zone);
      return Date.parse(`${c.date}T00:00:00Z`) + c.minutes * 60_000 - Math.floor(ms / 60_000) * 60_000;
    };
    const before = at(midnight - 14 * 3_600_000);
    hit = Number.isFinite(before) && before === at(midnight + 38 * 3_600_000) ? before : null;
    cache.set(date, hit);
  }
  return hit;
}

function exactInstant(text: string, zone: string, where: Where): number {
  const ms = parseTimestamp(text, where);
  const m = WITH_OFFSET.exec(text)!;
  if (/^(Z|[+-]00(:?00)?)$/i.test(m[7])) return ms; // UTC itself: exact, whatever the zone
  const local = toWallClock(ms, zone);
  const written: WallClock = { date: `${m[1]}-${m[2]}-${m[3]}`, minutes: Number(m[4]) * 60 + Number(m[5]) };
  if (local.date !== written.date || local.minutes !== written.minutes) {
    throw new InputError(`"${text}" is not a local time of ${zone} (its UTC offset differs); give timestamps of the market's own zone`, where);
  }
  return ms;
}

function relocating<T>(where: Where, f: () => T): T {
  try {
    return f();
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
