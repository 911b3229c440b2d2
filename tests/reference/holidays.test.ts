/**
 * Reference checks: the holiday calendar (date-holidays data behind
 * holidayName) against dates fixed in law or computable by a published
 * algorithm. Each check names its source.
 */
import { describe, expect, it } from 'vitest';
import { holidayName, holidaysOfYear } from '../../src/engine/calendar/holidays';
import { addDays, isoWeekday } from '../../src/engine/calendar/weekday';

const GERMAN_STATES = ['BB', 'BE', 'BW', 'BY', 'HB', 'HE', 'HH', 'MV', 'NI', 'NW', 'RP', 'SH', 'SL', 'SN', 'ST', 'TH'];

/**
 * Gregorian Easter Sunday by the Meeus/Jones/Butcher algorithm.
 * Source: Jean Meeus, Astronomical Algorithms (2nd ed., 1998), ch. 8 "Date of Easter".
 */
function easterSunday(year: number): string {
  const a = year % 19;
  const b = Math.floor(year / 100);
  const c = year % 100;
  const d = Math.floor(b / 4);
  const e = b % 4;
  const f = Math.floor((b + 8) / 25);
  const g = Math.floor((b - f + 1) / 3);
  const h = (19 * a + b - d - g + 15) % 30;
  const i = Math.floor(c / 4);
  const k = c % 4;
  const l = (32 + 2 * e + 2 * i - h - k) % 7;
  const m = Math.floor((a + 11 * h + 22 * l) / 451);
  const month = Math.floor((h + l - 7 * m + 114) / 31);
  const day = ((h + l - 7 * m + 114) % 31) + 1;
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** The n-th (1-based) given ISO weekday of a month; n = -1 for the last one. */
function nthWeekday(year: number, month: number, weekday: number, n: number): string {
  const first = `${year}-${String(month).padStart(2, '0')}-01`;
  if (n > 0) {
    const shift = (weekday - isoWeekday(first) + 7) % 7;
    return addDays(first, shift + 7 * (n - 1));
  }
  const last = addDays(month === 12 ? `${year + 1}-01-01` : `${year}-${String(month + 1).padStart(2, '0')}-01`, -1);
  return addDays(last, -((isoWeekday(last) - weekday + 7) % 7));
}

describe('Meeus/Jones/Butcher Easter (the yardstick itself)', () => {
  it('reproduces the worked dates of Meeus, Astronomical Algorithms, ch. 8', () => {
    // Example years listed in Meeus ch. 8 (from memory).
    expect(easterSunday(1991)).toBe('1991-03-31');
    expect(easterSunday(1992)).toBe('1992-04-19');
    expect(easterSunday(1993)).toBe('1993-04-11');
    expect(easterSunday(1954)).toBe('1954-04-18');
    expect(easterSunday(2000)).toBe('2000-04-23');
    expect(easterSunday(1818)).toBe('1818-03-22');
  });

  it('always gives a Sunday between 22 March and 25 April (Gregorian computus bounds, from memory)', () => {
    for (let y = 1900; y <= 2100; y++) {
      const e = easterSunday(y);
      expect(isoWeekday(e), e).toBe(7);
      expect(e >= `${y}-03-22` && e <= `${y}-04-25`, e).toBe(true);
    }
  });
});

describe('Easter-based holidays (Meeus, Astronomical Algorithms, ch. 8)', () => {
  it('Easter Monday 2024, 2025, 2026 is a public holiday in Germany, every German state and France', () => {
    const mondays = [2024, 2025, 2026].map((y) => addDays(easterSunday(y), 1));
    // The algorithm gives 1 April 2024, 21 April 2025, 6 April 2026.
    expect(mondays).toEqual(['2024-04-01', '2025-04-21', '2026-04-06']);
    for (const d of mondays) {
      expect(holidayName(d, 'DE'), d).toBe('Ostermontag');
      for (const s of GERMAN_STATES) expect(holidayName(d, `DE-${s}`), `DE-${s} ${d}`).not.toBe('');
      // France: Code du travail, art. L3133-1 ("le lundi de Pâques").
      expect(holidayName(d, 'FR'), d).not.toBe('');
      // The day after Easter Monday is an ordinary working day in Germany.
      expect(holidayName(addDays(d, 1), 'DE'), addDays(d, 1)).toBe('');
    }
  });

  it('Good Friday (−2), Ascension (+39) and Whit Monday (+50) in Germany, 2020–2035', () => {
    // Public in all 16 Länder under their holiday laws (from memory); dates from the Easter algorithm.
    for (let y = 2020; y <= 2035; y++) {
      const e = easterSunday(y);
      for (const [offset, name] of [
        [-2, 'Karfreitag'],
        [1, 'Ostermontag'],
        [39, 'Christi Himmelfahrt'],
        [50, 'Pfingstmontag'],
      ] as const) {
        expect(holidayName(addDays(e, offset), 'DE'), `${y} ${name}`).toBe(name);
      }
    }
  });
});

describe('Germany: Tag der Deutschen Einheit on 3 October', () => {
  it('is a public holiday nationwide and in every state, 1991–2035', () => {
    // Einigungsvertrag (Unification Treaty) of 31 August 1990, Art. 2 Abs. 2:
    // "Der 3. Oktober ist als Tag der Deutschen Einheit gesetzlicher Feiertag."
    for (let y = 1991; y <= 2035; y++) {
      expect(holidayName(`${y}-10-03`, 'DE'), String(y)).toBe('Tag der Deutschen Einheit');
      expect(holidayName(`${y}-10-02`, 'DE'), String(y)).toBe('');
    }
    for (const s of GERMAN_STATES) expect(holidayName('2025-10-03', `DE-${s}`), s).not.toBe('');
  });
});

describe('Christmas', () => {
  it('25 and 26 December in Germany, 25 December in France and the US, 2020–2035', () => {
    for (let y = 2020; y <= 2035; y++) {
      // Germany: 1. and 2. Weihnachtstag in all Länder holiday laws (from memory).
      expect(holidayName(`${y}-12-25`, 'DE')).not.toBe('');
      expect(holidayName(`${y}-12-26`, 'DE')).not.toBe('');
      // France: Code du travail, art. L3133-1 ("le jour de Noël"); 26 December is not listed.
      expect(holidayName(`${y}-12-25`, 'FR')).not.toBe('');
      expect(holidayName(`${y}-12-26`, 'FR')).toBe('');
      // United States: 5 U.S.C. 6103(a) ("Christmas Day, December 25").
      expect(holidayName(`${y}-12-25`, 'US')).toBe('Christmas Day');
    }
  });
});

describe('France: the eleven jours fériés of Code du travail, art. L3133-1', () => {
  it('are exactly the public holidays for 2024–2030', () => {
    // L3133-1: 1er janvier, lundi de Pâques, 1er mai, 8 mai, Ascension, lundi de Pentecôte,
    // 14 juillet, Assomption (15 août), Toussaint (1er novembre), 11 novembre, jour de Noël.
    for (let y = 2024; y <= 2030; y++) {
      const e = easterSunday(y);
      const expected = [
        `${y}-01-01`,
        addDays(e, 1),
        `${y}-05-01`,
        `${y}-05-08`,
        addDays(e, 39),
        addDays(e, 50),
        `${y}-07-14`,
        `${y}-08-15`,
        `${y}-11-01`,
        `${y}-11-11`,
        `${y}-12-25`,
      ].sort();
      expect([...holidaysOfYear(y, 'FR').keys()], String(y)).toEqual(expected);
    }
  });
});

describe('United States: federal holidays of 5 U.S.C. 6103(a)', () => {
  it('fall on their fixed dates and weekday rules, 2022–2035', () => {
    for (let y = 2022; y <= 2035; y++) {
      const rules: [string, string][] = [
        [`${y}-01-01`, "New Year's Day"],
        [nthWeekday(y, 1, 1, 3), 'Birthday of Martin Luther King, Jr.: third Monday in January'],
        [nthWeekday(y, 2, 1, 3), "Washington's Birthday: third Monday in February"],
        [nthWeekday(y, 5, 1, -1), 'Memorial Day: last Monday in May'],
        [`${y}-06-19`, 'Juneteenth National Independence Day (added 2021)'],
        [`${y}-07-04`, 'Independence Day'],
        [nthWeekday(y, 9, 1, 1), 'Labor Day: first Monday in September'],
        [nthWeekday(y, 10, 1, 2), 'Columbus Day: second Monday in October'],
        [`${y}-11-11`, 'Veterans Day'],
        [nthWeekday(y, 11, 4, 4), 'Thanksgiving Day: fourth Thursday in November'],
        [`${y}-12-25`, 'Christmas Day'],
      ];
      for (const [date, rule] of rules) expect(holidayName(date, 'US'), `${rule} ${date}`).not.toBe('');
    }
  });

  it('Thanksgiving is the fourth Thursday, never the fifth', () => {
    // 5 U.S.C. 6103(a): "Thanksgiving Day, the fourth Thursday in November."
    // November 2029 has five Thursdays (1st is a Thursday): 22nd is Thanksgiving, 29th is not.
    expect(nthWeekday(2029, 11, 4, 4)).toBe('2029-11-22');
    expect(holidayName('2029-11-22', 'US')).toBe('Thanksgiving Day');
    expect(holidayName('2029-11-29', 'US')).toBe('');
    expect(holidayName('2025-11-27', 'US')).toBe('Thanksgiving Day');
    expect(holidayName('2026-11-26', 'US')).toBe('Thanksgiving Day');
  });

  it('a holiday on a Saturday is observed the Friday before, on a Sunday the Monday after', () => {
    // 5 U.S.C. 6103(b) (Saturday → preceding Friday) and Executive Order 11582 (Sunday → following Monday).
    expect(isoWeekday('2026-07-04')).toBe(6);
    expect(holidayName('2026-07-03', 'US')).not.toBe('');
    expect(isoWeekday('2021-12-25')).toBe(6);
    expect(holidayName('2021-12-24', 'US')).not.toBe('');
    expect(isoWeekday('2022-12-25')).toBe(7);
    expect(holidayName('2022-12-26', 'US')).not.toBe('');
    expect(isoWeekday('2023-01-01')).toBe(7);
    expect(holidayName('2023-01-02', 'US')).not.toBe('');
  });
});
