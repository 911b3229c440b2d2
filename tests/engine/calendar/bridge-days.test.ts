import { describe, expect, it } from 'vitest';
import { isBridgeDay } from '../../../src/engine/calendar/bridge-days';
import { holidayName } from '../../../src/engine/calendar/holidays';
import { addDays, isoWeekday } from '../../../src/engine/calendar/weekday';
import { InputError } from '../../../src/engine/errors';

describe('isBridgeDay(date, region)', () => {
  it('is true for the Friday after a Thursday holiday', () => {
    // Ascension Day 2025 was Thursday 29 May (Easter 20 April + 39 days).
    expect(isoWeekday('2025-05-29')).toBe(4);
    expect(isBridgeDay('2025-05-30', 'DE')).toBe(true);
  });

  it('is true for the Monday before a Tuesday holiday', () => {
    // Tag der Deutschen Einheit 2029 falls on Wednesday; 2028 on Tuesday (3 October).
    expect(isoWeekday('2028-10-03')).toBe(2);
    expect(isBridgeDay('2028-10-02', 'DE')).toBe(true);
  });

  it('is true for a single working day between two holidays', () => {
    // FR 2029: Victory Day Tuesday 8 May, Ascension Thursday 10 May (Easter 1 April + 39 days).
    expect(isoWeekday('2029-05-09')).toBe(3);
    expect(holidayName('2029-05-08', 'FR')).not.toBe('');
    expect(holidayName('2029-05-10', 'FR')).not.toBe('');
    expect(isBridgeDay('2029-05-09', 'FR')).toBe(true);
    // FR 2025: Thursday 1 May and Thursday 8 May → Fridays 2 and 9 May.
    expect(isBridgeDay('2025-05-02', 'FR')).toBe(true);
    expect(isBridgeDay('2025-05-09', 'FR')).toBe(true);
  });

  it('is false on holidays, weekends, and ordinary working days', () => {
    expect(isBridgeDay('2025-05-29', 'DE')).toBe(false); // the holiday itself
    expect(isBridgeDay('2025-05-31', 'DE')).toBe(false); // Saturday
    expect(isBridgeDay('2025-06-04', 'DE')).toBe(false); // ordinary Wednesday
    // Friday after a Thursday that is a holiday only in Bavaria (Corpus Christi, 19 June 2025):
    expect(isBridgeDay('2025-06-20', 'DE-BY')).toBe(true);
    expect(isBridgeDay('2025-06-20', 'DE-HH')).toBe(false);
  });

  it('is false for a two-day gap (only one-day gaps count)', () => {
    // Christmas 2024 DE: Wed 25 and Thu 26 Dec are holidays; Fri 27 is a bridge day, Mon 23 + Tue 24 are not.
    expect(isBridgeDay('2024-12-27', 'DE')).toBe(true);
    expect(isBridgeDay('2024-12-24', 'DE')).toBe(false);
    expect(isBridgeDay('2024-12-23', 'DE')).toBe(false);
  });

  it('always picks a working weekday whose both neighbours are days off', () => {
    const off = (d: string) => isoWeekday(d) > 5 || holidayName(d, 'DE-BY') !== '';
    let found = 0;
    for (let d = '2024-01-01'; d <= '2027-12-31'; d = addDays(d, 1)) {
      const expected = !off(d) && off(addDays(d, -1)) && off(addDays(d, 1));
      expect(isBridgeDay(d, 'DE-BY'), d).toBe(expected);
      if (expected) found++;
    }
    expect(found).toBeGreaterThan(4);
  });

  it('passes on bad input as InputError', () => {
    expect(() => isBridgeDay('2025-02-30', 'DE')).toThrow(InputError);
    expect(() => isBridgeDay('2025-05-30', 'XX')).toThrow(InputError);
  });
});
