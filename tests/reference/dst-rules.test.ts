import { describe, expect, it } from 'vitest';
import { buildSeries, dayLengthMinutes, deliveryDays, parseCsv, wallClockToUtc } from '../../src/engine';

// EU summer time: Directive 2000/84/EC, Art. 2 and 3 — begins and ends at
// 01:00 UTC on the last Sunday of March and of October.
// US daylight saving time: 15 U.S.C. 260a as amended by the Energy Policy Act
// of 2005 — 02:00 local on the second Sunday of March to the first Sunday of November.
describe('delivery-day lengths follow the published summer-time rules', () => {
  it.each([
    ['Europe/Berlin', '2025-03-30', 23 * 60],
    ['Europe/Berlin', '2025-10-26', 25 * 60],
    ['Europe/Berlin', '2026-03-29', 23 * 60],
    ['Europe/Berlin', '2026-10-25', 25 * 60],
    ['Europe/Berlin', '2026-03-28', 24 * 60],
    ['Europe/Lisbon', '2025-03-30', 23 * 60],
    ['America/New_York', '2025-03-09', 23 * 60],
    ['America/New_York', '2025-11-02', 25 * 60],
    ['America/New_York', '2025-10-26', 24 * 60],
  ])('%s %s has %d minutes', (zone, date, minutes) => {
    expect(dayLengthMinutes(date, zone)).toBe(minutes);
  });

  it('the EU change happens at 01:00 UTC in every EU zone (Directive 2000/84/EC)', () => {
    // 03:00 CEST in Berlin and 02:00 EEST in Helsinki... both the first instant after 01:00 UTC
    expect(new Date(wallClockToUtc({ date: '2025-03-30', minutes: 180 }, 'Europe/Berlin')).toISOString()).toBe('2025-03-30T01:00:00.000Z');
    expect(new Date(wallClockToUtc({ date: '2025-03-30', minutes: 240 }, 'Europe/Helsinki')).toISOString()).toBe('2025-03-30T01:00:00.000Z');
    expect(new Date(wallClockToUtc({ date: '2025-10-26', minutes: 120 }, 'Europe/Berlin', true)).toISOString()).toBe('2025-10-26T01:00:00.000Z');
    expect(new Date(wallClockToUtc({ date: '2025-10-26', minutes: 120 }, 'Europe/Berlin', false)).toISOString()).toBe('2025-10-26T00:00:00.000Z');
  });

  it('refuses a wall time the clocks skip', () => {
    expect(() => wallClockToUtc({ date: '2025-03-30', minutes: 150 }, 'Europe/Berlin')).toThrow(/does not exist/);
  });

  function quarterHours(zone: string, fromUtc: string, hours: number) {
    const rows = ['timestamp,price'];
    const t0 = Date.parse(fromUtc);
    for (let k = 0; k < hours * 4; k++) rows.push(`${new Date(t0 + k * 900_000).toISOString()},1`);
    return buildSeries(parseCsv(rows.join('\n'), 'q.csv'), { zone }).series;
  }

  it('quarter-hour delivery days hold 92 and 100 periods on the EU change days', () => {
    // local 2025-03-29 00:00 CET = 2025-03-28T23:00Z; three local days
    const spring = deliveryDays(quarterHours('Europe/Berlin', '2025-03-28T23:00:00Z', 71));
    expect(spring.map((d) => [d.date, d.count])).toEqual([['2025-03-29', 96], ['2025-03-30', 92], ['2025-03-31', 96]]);
    const autumn = deliveryDays(quarterHours('Europe/Berlin', '2025-10-24T22:00:00Z', 73));
    expect(autumn.map((d) => [d.date, d.count])).toEqual([['2025-10-25', 96], ['2025-10-26', 100], ['2025-10-27', 96]]);
  });
});
