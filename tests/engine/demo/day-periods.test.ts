import { describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { dayPeriods } from '../../../src/engine/demo/day-periods';
import { InputError } from '../../../src/engine/errors';

const count = (date: string, zone: string, res: 15 | 30 | 60) => dayPeriods(date, date, zone, res)[0].start.length;

describe('dayPeriods(first, last, zone, resolution)', () => {
  it('has 23 and 25 hours on the EU clock-change Sundays, 24 otherwise', () => {
    // Directive 2000/84/EC: summer time starts and ends at 01:00 UTC on the last Sunday
    // of March and of October: 30 March and 26 October 2025.
    expect(count('2025-03-30', 'Europe/Berlin', 60)).toBe(23);
    expect(count('2025-10-26', 'Europe/Berlin', 60)).toBe(25);
    expect(count('2025-06-01', 'Europe/Berlin', 60)).toBe(24);
    expect(count('2025-03-30', 'Europe/Berlin', 15)).toBe(92);
    expect(count('2025-10-26', 'Europe/Berlin', 15)).toBe(100);
  });

  it('has 92 and 100 quarter-hours on South Australian clock-change Sundays', () => {
    // South Australia: summer time from the first Sunday of October to the first
    // Sunday of April (IANA tz database, Australia/Adelaide; from memory).
    expect(count('2025-10-05', 'Australia/Adelaide', 15)).toBe(92);
    expect(count('2026-04-05', 'Australia/Adelaide', 15)).toBe(100);
    expect(count('2026-01-15', 'Australia/Adelaide', 15)).toBe(96);
  });

  it('shows the local clock: 02:00 skipped in spring, 02:00 twice in autumn (Berlin)', () => {
    const spring = dayPeriods('2025-03-30', '2025-03-30', 'Europe/Berlin', 60)[0];
    expect(spring.clock.slice(0, 4)).toEqual([0, 60, 180, 240]);
    expect(spring.offset.slice(0, 4)).toEqual([60, 60, 120, 120]);
    const autumn = dayPeriods('2025-10-26', '2025-10-26', 'Europe/Berlin', 60)[0];
    expect(autumn.clock.slice(0, 5)).toEqual([0, 60, 120, 120, 180]);
    expect(autumn.offset.slice(0, 5)).toEqual([120, 120, 120, 60, 60]);
  });

  it('agrees with luxon (general-purpose library) over two years in three zones', () => {
    for (const zone of ['Europe/Berlin', 'Australia/Adelaide', 'America/Denver']) {
      const days = dayPeriods('2025-01-01', '2026-12-31', zone, 30);
      expect(days.length).toBe(730);
      let expectedDate = DateTime.fromISO('2025-01-01', { zone });
      for (const day of days) {
        expect(day.date).toBe(expectedDate.toISODate());
        const from = expectedDate.startOf('day');
        const to = from.plus({ days: 1 });
        expect(day.start.length).toBe((to.toMillis() - from.toMillis()) / 1_800_000);
        // Every period on clock-change days; first, second and last period on the others.
        const n = day.start.length;
        const check = n === 48 ? [0, 1, n - 1] : day.start.map((_, k) => k);
        check.forEach((k) => {
          const t = day.start[k];
          expect(t).toBe(from.toMillis() + k * 1_800_000);
          const local = DateTime.fromMillis(t, { zone });
          expect(day.offset[k]).toBe(local.offset);
          expect(day.clock[k]).toBe(local.hour * 60 + local.minute);
        });
        expectedDate = expectedDate.plus({ days: 1 });
      }
    }
  });

  it('refuses an unknown zone or date', () => {
    expect(() => dayPeriods('2025-01-01', '2025-01-02', 'Mars/Olympus', 60)).toThrow(InputError);
    expect(() => dayPeriods('2025-02-30', '2025-03-02', 'Europe/Berlin', 60)).toThrow(InputError);
  });
});
