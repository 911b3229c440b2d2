import { describe, expect, it } from 'vitest';
import Holidays from 'date-holidays';
import { holidayName, holidaysOfYear } from '../../../src/engine/calendar/holidays';
import { addDays } from '../../../src/engine/calendar/weekday';
import { InputError } from '../../../src/engine/errors';

describe('holidayName(date, region)', () => {
  it('names a public holiday and gives "" on an ordinary day', () => {
    // Holiday names as the date-holidays package spells them (German for DE).
    expect(holidayName('2025-10-03', 'DE')).toBe('Tag der Deutschen Einheit');
    expect(holidayName('2025-10-02', 'DE')).toBe('');
    expect(holidayName('2025-07-14', 'FR')).not.toBe('');
  });

  it('reads the state part of the region and ignores letter case', () => {
    // Epiphany (6 January) is a public holiday in Bavaria, not in Germany as a whole (from memory).
    expect(holidayName('2025-01-06', 'DE-BY')).not.toBe('');
    expect(holidayName('2025-01-06', 'de-by')).toBe(holidayName('2025-01-06', 'DE-BY'));
    expect(holidayName('2025-01-06', 'DE')).toBe('');
    expect(holidayName('2025-01-06', 'DE-HH')).toBe('');
  });

  it('counts only public holidays: bank, school and observance days give ""', () => {
    // date-holidays types Ash Wednesday as observance and Buß- und Bettag in Bavaria as school.
    expect(holidayName('2025-03-05', 'DE-BY')).toBe('');
    expect(holidayName('2025-11-19', 'DE-BY')).toBe('');
    // ... while Saxony has Buß- und Bettag as a public holiday (from memory: Sächsisches Feiertagsgesetz).
    expect(holidayName('2025-11-19', 'DE-SN')).not.toBe('');
  });

  it('leaves out part-day holidays that start after midnight', () => {
    // South Australia: Christmas Eve and New Year's Eve are public holidays from 19:00 only
    // (date-holidays data; from memory: Holidays Act 1910 (SA), amended 2012).
    const data = new Holidays('AU', 'SA', { types: ['public'] }).getHolidays(2025);
    const eve = data.find((h) => h.date.startsWith('2025-12-24'));
    expect(eve?.date.slice(11)).not.toBe('00:00:00'); // the package does list it, as a part day
    expect(holidayName('2025-12-24', 'AU-SA')).toBe('');
    expect(holidayName('2025-12-25', 'AU-SA')).not.toBe('');
  });

  it('does not depend on the time zone the process runs in', () => {
    // Tests run with TZ=America/Sao_Paulo (vitest.config.ts). Brazil's clocks jumped from
    // 00:00 to 01:00 on 3 October 1999 (IANA tz database, America/Sao_Paulo), so the package dates that holiday
    // "1999-10-03 01:00:00" here; it must still count as a whole-day holiday.
    expect(holidayName('1999-10-03', 'DE')).toBe('Tag der Deutschen Einheit');
    expect(holidayName('2025-10-03', 'DE')).toBe('Tag der Deutschen Einheit');
  });

  it('counts a holiday on each of its days', () => {
    // Spring Festival 2025 in mainland China: date-holidays lists 28–30 January.
    for (const d of ['2025-01-28', '2025-01-29', '2025-01-30']) expect(holidayName(d, 'CN')).not.toBe('');
  });

  it('matches the date-holidays package day by day over several years', () => {
    // The cache must not change answers: compare with a fresh instance of the package.
    for (const region of ['DE', 'DE-BY', 'FR', 'US-CA']) {
      const [country, state] = region.split('-');
      const fresh = state
        ? new Holidays(country, state, { types: ['public'] })
        : new Holidays(country, { types: ['public'] });
      const expected = new Map<string, string>();
      for (let y = 2023; y <= 2027; y++) {
        for (const h of fresh.getHolidays(y)) {
          const hours = (h.end.getTime() - h.start.getTime()) / 3_600_000;
          if (h.type === 'public' && hours >= 20) expected.set(h.date.slice(0, 10), h.name);
        }
      }
      for (let d = '2023-01-01'; d <= '2027-12-31'; d = addDays(d, 1)) {
        const got = holidayName(d, region);
        const want = expected.get(d);
        if (want === undefined) expect(got, `${region} ${d}`).toBe('');
        else expect(got.split(' / '), `${region} ${d}`).toContain(want);
      }
    }
  });

  it('refuses an unknown region with a message naming it', () => {
    expect(() => holidayName('2025-01-01', 'XX')).toThrow(InputError);
    expect(() => holidayName('2025-01-01', 'XX')).toThrow(/"XX".*DE-BY/);
    expect(() => holidayName('2025-01-01', 'DE-ZZ')).toThrow(/"DE-ZZ"/);
    expect(() => holidayName('2025-01-01', '')).toThrow(InputError);
    expect(() => holidayName('2025-01-01', 'DE-BY-X-Y')).toThrow(InputError);
  });

  it('refuses a date that does not exist', () => {
    expect(() => holidayName('2025-02-30', 'DE')).toThrow(InputError);
    expect(() => holidayName('2025-1-1', 'DE')).toThrow(InputError);
    expect(() => holidayName('', 'DE')).toThrow(InputError);
  });

  it('answers every day of ten years a hundred times with the same count (speed: npm run bench, bench/engine-speed.ts)', () => {
    const days: string[] = [];
    for (let d = '2020-01-01'; d <= '2029-12-31'; d = addDays(d, 1)) days.push(d);
    holidayName(days[0], 'DE-NW');
    let count = 0;
    for (let r = 0; r < 100; r++) for (const d of days) if (holidayName(d, 'DE-NW') !== '') count++;
    expect(count).toBe(100 * [...Array(10).keys()].reduce((s, k) => s + holidaysOfYear(2020 + k, 'DE-NW').size, 0));
  });
});

describe('holidaysOfYear(year, region)', () => {
  it('lists the year in date order and agrees with holidayName', () => {
    const map = holidaysOfYear(2026, 'FR');
    const keys = [...map.keys()];
    expect(keys).toEqual([...keys].sort());
    expect(keys.every((d) => d.startsWith('2026-'))).toBe(true);
    for (const [d, name] of map) expect(holidayName(d, 'FR')).toBe(name);
  });

  it('refuses a fractional year or an unknown region', () => {
    expect(() => holidaysOfYear(2025.5, 'DE')).toThrow(InputError);
    expect(() => holidaysOfYear(2025, 'Atlantis')).toThrow(InputError);
  });
});
