import { dayNumber } from '../calendar/weekday';
import { InputError, type Where } from '../errors';
import { checkZone, toWallClock, wallClockToUtc } from './local-clock';
import { parseTimestamp } from './parse-timestamp';
import { quoteCell } from './quote-cell';
import type { WallClock } from './serial-date';

/**
 * The one reader of delivery-period timestamps, for data files and cells
 * alike, in the market zone `zone`:
 *
 * - text with a UTC offset or `Z` (`2025-03-30T03:00:00+02:00`, ISO 8601)
 *   is an exact instant;
 * - text without an offset (`2025-10-26 02:00`, `2025-10-26T02:00`,
 *   `2025-10-26T02:00:00`, a bare date for midnight) is wall-clock time in
 *   the zone, and so is a wall clock handed over directly (a cell's serial
 *   date, see serial-date.ts).
 *
 * Wall-clock times repeat on the day the clocks go back: the first time a
 * repeated time appears it is the earlier instant, the second time the later
 * one, so the reader keeps state and must read the rows in their order (one
 * reader per file or range). A wall-clock time in the hour the clocks skip
 * does not exist and is refused, naming the row and column.
 *
 * @param zone - IANA zone of the market, e.g. Europe/Berlin
 * @param options.zoneOffsetsOnly - refuse an offset other than UTC's that is
 *   not the zone's own at that instant (the cell functions' rule: such a
 *   timestamp belongs to another market)
 * @example timestampReader('Europe/Berlin').text('2025-10-26 02:00') // 1761436800000 (00:00 UTC); a second call gives 01:00 UTC
 * Source: ISO 8601-1:2019, 5.4 (local time, UTC offset); IANA tz database rules (EU: Directive 2000/84/EC).
 */
export interface TimestampReader {
  /** UTC ms of a timestamp text (trimmed); refused when it is none */
  text(text: string, where?: Where): number;
  /** UTC ms of a wall-clock time in the zone */
  wall(wall: WallClock, where?: Where): number;
  /** where the first wall-clock time that the autumn change repeats was read, if any (its instant came from row order) */
  readonly firstRepeated: Where | undefined;
}

const HAS_OFFSET = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)$/i;
const LOCAL = /^(\d{4}-\d{2}-\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.0+)?)?)?$/i;
const UTC_ITSELF = /(Z|[+-]00(:?00)?)$/i;

export function timestampReader(zone: string, options: { zoneOffsetsOnly?: boolean } = {}): TimestampReader {
  checkZone(zone);
  const seen = new Set<string>();
  const offsets = new Map<string, number | null>();
  let firstRepeated: Where | undefined;

  const wall = (clock: WallClock, where: Where = {}): number => {
    // fast path: on a day without a clock change the zone's offset is one number
    const offset = dayOffset(clock.date, zone, offsets);
    if (offset !== null) return Date.parse(`${clock.date}T00:00:00Z`) + clock.minutes * 60_000 - offset;
    const early = relocating(where, () => wallClockToUtc(clock, zone, false));
    const late = wallClockToUtc(clock, zone, true);
    if (early === late) return early;
    const key = `${clock.date} ${clock.minutes}`;
    const second = seen.has(key);
    seen.add(key);
    firstRepeated ??= where;
    return second ? late : early;
  };

  const text = (raw: string, where: Where = {}): number => {
    const t = raw.trim();
    if (HAS_OFFSET.test(t)) {
      const ms = parseTimestamp(t, where);
      if (options.zoneOffsetsOnly && !UTC_ITSELF.test(t)) checkOwnOffset(t, ms, zone, where);
      return ms;
    }
    const m = LOCAL.exec(t);
    if (!m) {
      throw new InputError(
        `${quoteCell(t)} is not a timestamp; write it like 2025-03-30T03:00:00+02:00 or 2025-03-30T01:00:00Z, or as local time of ${zone} like 2025-03-30 03:00`,
        where,
      );
    }
    if (m[4] !== undefined && m[4] !== '00') throw new InputError(`${quoteCell(t)} has seconds; delivery periods start on whole minutes`, where);
    const minutes = m[2] === undefined ? 0 : Number(m[2]) * 60 + Number(m[3]);
    if (minutes >= 1440 || Number(m[3] ?? 0) > 59) throw new InputError(`${quoteCell(t)} is not a time of day`, where);
    relocating(where, () => dayNumber(m[1]));
    return wall({ date: m[1], minutes }, where);
  };

  return { text, wall, get firstRepeated() { return firstRepeated; } };
}

/** Refuses an offset timestamp whose written local time is not the zone's at that instant. */
function checkOwnOffset(text: string, ms: number, zone: string, where: Where): void {
  const local = toWallClock(ms, zone);
  const written: WallClock = { date: text.slice(0, 10), minutes: Number(text.slice(11, 13)) * 60 + Number(text.slice(14, 16)) };
  if (local.date !== written.date || local.minutes !== written.minutes) {
    throw new InputError(`${quoteCell(text)} is not a local time of ${zone} (its UTC offset differs); give timestamps of the market's own zone`, where);
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

/** Runs f, giving an InputError without a place the reader's row and column. */
function relocating<T>(where: Where, f: () => T): T {
  try {
    return f();
  } catch (err) {
    if (err instanceof InputError && Object.keys(err.where).length === 0) throw new InputError(err.message, where);
    throw err;
  }
}
