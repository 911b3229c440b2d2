import { IANAZone } from 'luxon';

const WINDOW = 6 * 3_600_000;

/**
 * A fast lookup of a zone's UTC offset (local minus UTC, in minutes) for
 * many instants, as deliveryDays needs for up to millions of periods. The
 * tz database offset is read only at the edges of 6-hour UTC windows; in
 * the rare window where it differs between the edges, the instant of the
 * change is found by bisection to the millisecond. This holds as long as a
 * zone changes its offset at most once in 6 hours, which the tz database's
 * rules do (daylight-saving changes are months apart). Changes that are not
 * on the UTC hour (Australia/Lord_Howe's 30-minute spring shift at 15:30 UTC) and
 * offsets that are not whole hours (Asia/Kolkata, Australia/Adelaide) come
 * out exact.
 *
 * @param zone - an IANA zone name, checked by the caller
 * @returns offsetAt(ms), minutes to add to UTC for the local wall clock
 * @example offsetLookup('Europe/Berlin')(Date.parse('2025-07-01T00:00Z')) // 120
 * Source: IANA tz database, through luxon's IANAZone.offset.
 */
export function offsetLookup(zone: string): (ms: number) => number {
  const tz = IANAZone.create(zone);
  let from = NaN, before = 0, after = 0, change = Infinity;
  return (ms) => {
    const w = ms - (((ms % WINDOW) + WINDOW) % WINDOW);
    if (w !== from) {
      from = w;
      before = tz.offset(w);
      after = tz.offset(w + WINDOW);
      change = Infinity;
      if (before !== after) {
        let lo = w, hi = w + WINDOW; // offset(lo) = before, offset(hi) = after
        while (hi - lo > 1) {
          const mid = Math.floor((lo + hi) / 2);
          if (tz.offset(mid) === before) lo = mid; else hi = mid;
        }
        change = hi;
      }
    }
    return ms < change ? before : after;
  };
}
