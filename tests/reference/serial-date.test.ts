import { describe, expect, it } from 'vitest';
import { serialToWallClock, wallClockToSerial } from '../../src/engine';

// Source: ECMA-376 Part 1, §18.17.4.1 (1900 date system: serial 1 = 1900-01-01,
// and the phantom 1900-02-29 at serial 60). The values below were checked by
// counting days: 1970-01-01 is 25 567 days after 1900-01-01 (70 years, 17 leap
// days), so serial 25569 = 1970-01-01 once the phantom day is added.
describe('serialToWallClock(serial) — ECMA-376 1900 date system', () => {
  it.each([
    [1, '1900-01-01'],
    [59, '1900-02-28'],
    [61, '1900-03-01'],
    [25569, '1970-01-01'],
    [45658, '2025-01-01'],
    [46112, '2026-03-31'], // 45658 + 365 = 46023 is 2026-01-01, then 31 + 28 + 30 days
  ])('serial %d is %s', (serial, date) => {
    expect(serialToWallClock(serial)).toEqual({ date, minutes: 0 });
  });

  it('reads the fraction as the wall-clock time of day', () => {
    expect(serialToWallClock(45658.75)).toEqual({ date: '2025-01-01', minutes: 18 * 60 });
    expect(serialToWallClock(45658 + 1 / 96)).toEqual({ date: '2025-01-01', minutes: 15 });
  });

  it('refuses serial 60, the day that never existed', () => {
    expect(() => serialToWallClock(60)).toThrow(/never existed/);
  });

  it('refuses values that are not serials', () => {
    expect(() => serialToWallClock(0)).toThrow(/not a spreadsheet date serial/);
    expect(() => serialToWallClock(Number.NaN)).toThrow(/not a spreadsheet date serial/);
  });

  it('wallClockToSerial inverts it', () => {
    expect(wallClockToSerial({ date: '2025-01-01', minutes: 360 })).toBeCloseTo(45658.25, 12);
  });
});
