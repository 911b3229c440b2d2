import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DateTime } from 'luxon';
import { addDays, dateOfDayNumber, dayNumber, isoWeekday } from '../../../src/engine/calendar/weekday';
import { InputError } from '../../../src/engine/errors';

// Any real date from 1900-01-01 to 2199-12-31, as YYYY-MM-DD.
const dates = fc
  .integer({ min: dayNumber('1900-01-01'), max: dayNumber('2199-12-31') })
  .map((n) => dateOfDayNumber(n));

describe('isoWeekday(date)', () => {
  it('numbers Monday 1 … Sunday 7 on known dates', () => {
    // from memory: 1970-01-01 was a Thursday, 2000-01-01 a Saturday,
    // 2025-03-30 the last Sunday of March 2025 (EU summer time start).
    expect(isoWeekday('1970-01-01')).toBe(4);
    expect(isoWeekday('2000-01-01')).toBe(6);
    expect(isoWeekday('2025-03-30')).toBe(7);
    expect(isoWeekday('2025-03-31')).toBe(1);
  });

  it('agrees with luxon (general-purpose library) for any date, whatever TZ the process runs in', () => {
    // The test run pins TZ to America/Sao_Paulo; the answer must not depend on it.
    fc.assert(
      fc.property(dates, (d) => {
        expect(isoWeekday(d)).toBe(DateTime.fromISO(d, { zone: 'UTC' }).weekday);
      }),
    );
  });

  it('refuses dates that do not exist or are badly written', () => {
    for (const bad of ['2025-02-29', '2025-13-01', '2025-00-10', '2025-04-31', '25-01-01', '2025-1-1', '', '2025-01-01T00:00']) {
      expect(() => isoWeekday(bad)).toThrow(InputError);
    }
    expect(() => isoWeekday('2025-02-30')).toThrow(/YYYY-MM-DD/);
  });

  it('accepts 29 February only in Gregorian leap years', () => {
    // Gregorian rule (Inter gravissimas, 1582): century years are leap only when divisible by 400.
    expect(isoWeekday('2024-02-29')).toBeGreaterThan(0);
    expect(isoWeekday('2000-02-29')).toBeGreaterThan(0);
    expect(() => isoWeekday('2100-02-29')).toThrow(InputError);
    expect(() => isoWeekday('1900-02-29')).toThrow(InputError);
  });
});

describe('addDays(date, n)', () => {
  it('crosses month, leap-day and year ends', () => {
    expect(addDays('2024-02-28', 1)).toBe('2024-02-29');
    expect(addDays('2023-02-28', 1)).toBe('2023-03-01');
    expect(addDays('2100-02-28', 1)).toBe('2100-03-01');
    expect(addDays('2025-12-31', 1)).toBe('2026-01-01');
    expect(addDays('2026-01-01', -1)).toBe('2025-12-31');
    expect(addDays('2025-03-30', 0)).toBe('2025-03-30');
  });

  it('gives the same calendar date across a daylight-saving change (no time zone involved)', () => {
    // 2025-03-30 and 2025-10-26 are EU clock-change Sundays (Directive 2000/84/EC).
    expect(addDays('2025-03-29', 1)).toBe('2025-03-30');
    expect(addDays('2025-03-30', 1)).toBe('2025-03-31');
    expect(addDays('2025-10-26', 1)).toBe('2025-10-27');
  });

  it('agrees with luxon plus(days) and moves the weekday by n mod 7', () => {
    fc.assert(
      fc.property(dates, fc.integer({ min: -4000, max: 4000 }), (d, n) => {
        const shifted = addDays(d, n);
        expect(shifted).toBe(DateTime.fromISO(d, { zone: 'UTC' }).plus({ days: n }).toISODate());
        expect(addDays(shifted, -n)).toBe(d);
        expect(isoWeekday(shifted)).toBe(((((isoWeekday(d) - 1 + n) % 7) + 7) % 7) + 1);
      }),
    );
  });

  it('refuses a fractional or unknown number of days', () => {
    expect(() => addDays('2025-01-01', 1.5)).toThrow(InputError);
    expect(() => addDays('2025-01-01', NaN)).toThrow(InputError);
    expect(() => addDays('2025-02-30', 1)).toThrow(InputError);
  });
});

describe('dayNumber(date) / dateOfDayNumber(n)', () => {
  it('counts days from 1970-01-01 and back', () => {
    expect(dayNumber('1970-01-01')).toBe(0);
    expect(dayNumber('1969-12-31')).toBe(-1);
    fc.assert(
      fc.property(dates, (d) => {
        expect(dateOfDayNumber(dayNumber(d))).toBe(d);
      }),
    );
  });
});
