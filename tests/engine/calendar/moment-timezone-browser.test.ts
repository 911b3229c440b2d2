import { data } from 'date-holidays/data';
import momentTz from 'moment-timezone';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import shim from '../../../src/engine/calendar/moment-timezone.browser';

/**
 * The browser build's luxon stand-in for moment-timezone against
 * moment-timezone itself (the package date-holidays uses in Node), for
 * every time zone the holiday data names, on the calls caldate and
 * date-holidays-parser make: wall-clock time of a zone to an instant
 * (including the hours a clock change skips or repeats), an instant to a
 * zone's wall clock, and fixed offsets.
 */
const zones = [...new Set(Object.values(data.holidays).flatMap((c) => (c as { zones?: string[] }).zones ?? []))].sort();
const pad = (n: number) => String(n).padStart(2, '0');

/**
 * moment-timezone carries its own copy of the time-zone database, the shim
 * reads the platform's (Intl): where the two copies' versions differ on a
 * zone's offset within a day of `at` (e.g. Asia/Almaty's move to UTC+5 on
 * 2024-03-01, in tzdata 2024a), the difference is one of data, not of the
 * shim, and the time is left out.
 */
function tzdataDiffers(zone: string, at: Date): boolean {
  for (const h of [-30, -12, 0, 12, 30]) {
    const t = at.getTime() + h * 3_600_000;
    const intl = DateTime.fromMillis(t, { zone }).offset;
    if (momentTz.tz(t, zone).utcOffset() !== intl) return true;
  }
  return false;
}

describe('moment-timezone.browser (luxon) against moment-timezone', () => {
  it(`knows the ${zones.length} zones of the holiday data`, () => {
    expect(zones.length).toBeGreaterThan(150);
  });

  it('moment.tz(wall clock, zone).format() gives the same instant, skipped and repeated hours included', () => {
    const mismatches: string[] = [];
    let backwards = 0;
    for (const zone of zones) {
      for (let day = 0; day < 730; day += 5) {
        const d = new Date(Date.UTC(2024, 0, 1 + day));
        for (const time of ['00:00:00', '01:30:00', '02:30:00', '03:00:00']) {
          const wall = `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${time}`;
          if (tzdataDiffers(zone, d)) continue;
          const want = new Date(momentTz.tz(wall, zone).format()).getTime();
          const got = new Date(shim.tz(wall, zone).format()).getTime();
          // At a change that turns the clock back at midnight (Asia/Almaty 2024-03-01, America/Scoresbysund
          // 2024-10-27) moment answers the instant of the change, whose wall clock is the previous day's 23:00,
          // not the time asked; the shim answers when that time first shows. Such answers are left out.
          if (DateTime.fromMillis(want, { zone }).toFormat('yyyy-MM-dd HH:mm:ss') < wall) { backwards++; continue; }
          if (want !== got) mismatches.push(`${zone} ${wall}: ${new Date(want).toISOString()} vs ${new Date(got).toISOString()}`);
        }
      }
    }
    expect(mismatches.slice(0, 5)).toEqual([]);
    expect(backwards).toBeLessThan(5);
  });

  it('moment.tz(date, zone) reads the same wall clock; moment(iso).tz / .utcOffset the same day', () => {
    const mismatches: string[] = [];
    const fields = (m: { year(): number; month(): number; date(): number; hours(): number; minutes(): number; seconds(): number }) =>
      [m.year(), m.month(), m.date(), m.hours(), m.minutes(), m.seconds()].join(' ');
    for (const zone of zones) {
      for (let h = 0; h < 2 * 8760; h += 97) {
        const at = new Date(Date.UTC(2024, 0, 1) + h * 3_600_000 + 17_000);
        if (tzdataDiffers(zone, at)) continue;
        if (fields(momentTz.tz(at, zone)) !== fields(shim.tz(at, zone))) mismatches.push(`${zone} ${at.toISOString()}`);
        const iso = at.toISOString();
        const a = momentTz(iso).tz(zone), b = shim(iso).tz(zone);
        if (a.month() !== b.month() || a.date() !== b.date()) mismatches.push(`${zone} iso ${iso}`);
      }
    }
    for (const offset of ['+08:00', '-03:30', '+00:00', '+05:45']) {
      const iso = '2025-03-20T09:01:00.000Z';
      const a = momentTz(iso).utcOffset(offset), b = shim(iso).utcOffset(offset);
      if (a.month() !== b.month() || a.date() !== b.date()) mismatches.push(`offset ${offset}`);
    }
    expect(mismatches.slice(0, 5)).toEqual([]);
  });
});
