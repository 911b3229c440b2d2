import fc from 'fast-check';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { inferResolution, parseNumber, parseTimestamp, serialToWallClock, wallClockToSerial } from '../../src/engine';
import { close, outcome, params } from './support';

const pad = (n: number, w = 2) => String(n).padStart(w, '0');

/** Components of a timestamp, valid or not, and the text written in one of the accepted spellings. */
const stamp = fc.record({
  year: fc.integer({ min: 0, max: 9999 }),
  month: fc.integer({ min: 0, max: 13 }),
  day: fc.integer({ min: 0, max: 32 }),
  hour: fc.integer({ min: 0, max: 25 }),
  minute: fc.integer({ min: 0, max: 61 }),
  second: fc.option(fc.integer({ min: 0, max: 61 }), { nil: undefined }),
  fraction: fc.option(fc.stringMatching(/^\d{1,9}$/), { nil: undefined }),
  offset: fc.option(fc.record({ sign: fc.constantFrom('+', '-'), h: fc.integer({ min: 0, max: 99 }), m: fc.integer({ min: 0, max: 99 }) }), { nil: undefined }),
  separator: fc.constantFrom('T', ' ', 't'),
  offsetStyle: fc.constantFrom('colon', 'plain', 'hours', 'space-colon'),
  zulu: fc.constantFrom('Z', 'z'),
  outerSpace: fc.constantFrom('', ' ', '\t', '  '),
});
type Stamp = typeof stamp extends fc.Arbitrary<infer T> ? T : never;

function write(s: Stamp): string {
  let text = `${pad(s.year, 4)}-${pad(s.month)}-${pad(s.day)}${s.separator}${pad(s.hour)}:${pad(s.minute)}`;
  if (s.second !== undefined || s.fraction !== undefined) text += `:${pad(s.second ?? 0)}`;
  if (s.fraction !== undefined) text += `.${s.fraction}`;
  if (!s.offset) text += s.zulu;
  else {
    const { sign, h, m } = s.offset;
    if (s.offsetStyle === 'colon') text += `${sign}${pad(h)}:${pad(m)}`;
    else if (s.offsetStyle === 'plain') text += `${sign}${pad(h)}${pad(m)}`;
    else if (s.offsetStyle === 'space-colon') text += ` ${sign}${pad(h)}:${pad(m)}`;
    else text += m === 0 ? `${sign}${pad(h)}` : `${sign}${pad(h)}:${pad(m)}`;
  }
  return s.outerSpace + text + s.outerSpace;
}

/** Whether ISO 8601 (date, time of day, UTC offset) calls these fields valid. */
function isValid(s: Stamp): boolean {
  const daysIn = s.month >= 1 && s.month <= 12 ? DateTime.utc(s.year, s.month, 1).daysInMonth! : 0;
  return s.month >= 1 && s.month <= 12 && s.day >= 1 && s.day <= daysIn && s.hour <= 23 && s.minute <= 59 &&
    (s.second ?? 0) <= 59 && (!s.offset || (s.offset.h <= 23 && s.offset.m <= 59));
}

/** Reference instant from luxon (a general-purpose date library), given the fields. */
function luxonInstant(s: Stamp): number {
  const offset = s.offset ? (s.offset.sign === '-' ? -1 : 1) * (s.offset.h * 60 + s.offset.m) : 0;
  const ms = s.fraction === undefined ? 0 : Math.round(Number(`0.${s.fraction}`) * 1000);
  return DateTime.fromObject(
    { year: s.year, month: s.month, day: s.day, hour: s.hour, minute: s.minute, second: s.second ?? 0 },
    { zone: 'utc' },
  ).toMillis() + ms - offset * 60_000;
}

describe('parseTimestamp(text) on generated timestamps', () => {
  it('gives the instant luxon gives for valid fields, an InputError for any field out of range', () => {
    fc.assert(fc.property(stamp, (s) => {
      const text = write(s);
      const r = outcome(() => parseTimestamp(text));
      if (isValid(s)) {
        expect(r.ok, `${text} should parse`).toBe(true);
        if (r.ok) expect(r.value).toBe(luxonInstant(s));
      } else {
        expect(r.ok, `${text} should be refused`).toBe(false);
      }
    }), params(3000, 1));
  });

  it('agrees with luxon DateTime.fromISO on valid colon-offset timestamps of any year', () => {
    const valid = stamp.map((s): Stamp => {
      const month = Math.min(Math.max(s.month, 1), 12);
      const day = Math.min(Math.max(s.day, 1), DateTime.utc(s.year, month, 1).daysInMonth!);
      const offset = s.offset && { ...s.offset, h: s.offset.h % 24, m: s.offset.m % 60 };
      return {
        ...s, month, day, hour: s.hour % 24, minute: s.minute % 60, second: s.second === undefined ? undefined : s.second % 60,
        fraction: s.fraction?.slice(0, 3), offset, separator: 'T', offsetStyle: 'colon', outerSpace: '',
      };
    });
    fc.assert(fc.property(valid, (s) => {
      const text = write(s).replace(/z$/, 'Z');
      expect(parseTimestamp(text)).toBe(DateTime.fromISO(text, { setZone: true }).toMillis());
    }), params(500, 2));
  });

  it('refuses local times without an offset, which are ambiguous on the autumn change', () => {
    const noOffset = stamp.filter(isValid).map((s) => write({ ...s, offset: undefined }).trim().replace(/[Zz]$/, ''));
    fc.assert(fc.property(noOffset, (text) => {
      expect(outcome(() => parseTimestamp(text)).ok, text).toBe(false);
    }), params(500, 3));
  });

  it('refuses other text, or reads it as luxon does when it happens to be a timestamp', () => {
    const junk = fc.oneof(
      fc.string({ unit: 'grapheme', maxLength: 40 }),
      fc.string({ unit: 'binary', maxLength: 40 }),
      fc.stringMatching(/^[0-9T:+\-Z. ]{10,30}$/),
      fc.constantFrom('', ' ', 'NaN', 'Infinity', '45658.5', '2025-03-30', '30.03.2025 02:00', '2025-03-30T02:00:00+02:00:00', '\u0662\u0660\u0662\u0665-03-30T02:00Z'),
    );
    fc.assert(fc.property(junk, (text) => {
      const r = outcome(() => parseTimestamp(text));
      if (r.ok) expect(r.value).toBe(DateTime.fromISO(text.trim().replace(' ', 'T').replace(/\s+/g, '').toUpperCase(), { setZone: true }).toMillis());
    }), params(1500, 13));
  });
});

/** Numbers written the ways a CSV export writes them. */
const numberText = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => String(x)),
  fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((x) => x.toFixed(4)),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => x.toExponential(6)),
  fc.integer().map((n) => `+${n < 0 ? -n : n}`),
  fc.integer({ min: 0, max: 999 }).map((n) => `.${n}`),
  fc.integer({ min: 0, max: 999 }).map((n) => `${n}.`),
  fc.integer({ min: 0, max: 999 }).map((n) => `00${n}`),
);

describe('parseNumber(text)', () => {
  it('reads plain decimals exactly as Number does, with surrounding spaces', () => {
    fc.assert(fc.property(numberText, fc.constantFrom('', ' ', '\t'), (text, space) => {
      const x = parseNumber(space + text + space);
      expect(x).toBe(Number(text));
      expect(Number.isFinite(x)).toBe(true);
    }), params(1500, 4));
  });

  it('never returns a non-finite number: blank is NaN (unknown), anything else is a finite number or an InputError', () => {
    const adversarial = fc.oneof(
      fc.string({ unit: 'grapheme', maxLength: 30 }),
      fc.stringMatching(/^[-+ .eE0-9]{0,12}$/),
      fc.constantFrom('NaN', 'nan', '-Infinity', 'Infinity', 'inf', '1e999', '-1e400', '1e-400', '0x1F', '1_000', '1,5', '12 34', '١٢', '１２', '--1', '+-1', 'e5', '.', '-.', '1e', '1e+'),
    );
    fc.assert(fc.property(adversarial, (text) => {
      const r = outcome(() => parseNumber(text));
      if (!r.ok) return;
      if (text.trim() === '') expect(r.value).toBeNaN();
      else {
        expect(Number.isFinite(r.value), `"${text}" gave ${r.value}`).toBe(true);
        expect(r.value).toBe(Number(text.trim()));
      }
    }), params(2000, 5));
  });
});

describe('serialToWallClock(serial)', () => {
  // Reference: day 0 of the 1900 date system is 1899-12-30 for serials from 61 on and
  // 1899-12-31 before the phantom 29 February 1900 (ECMA-376 Part 1, 18.17.4.1), via luxon.
  const reference = (serial: number) => {
    const totalMinutes = Math.round(serial * 1440);
    const days = Math.floor(totalMinutes / 1440);
    const base = Math.floor(serial) < 60 ? DateTime.utc(1899, 12, 31) : DateTime.utc(1899, 12, 30);
    return { date: base.plus({ days }).toISODate(), minutes: totalMinutes - days * 1440 };
  };

  it('gives a real date and minute for every serial of the range, an InputError outside it', () => {
    const serial = fc.oneof(
      fc.double({ min: -10, max: 3_000_000, noNaN: true }),
      fc.double({ min: 2_958_465, max: 2_958_466, noNaN: true }),
      fc.double({ min: 59, max: 62, noNaN: true }),
      fc.integer({ min: 1, max: 2_958_465 }),
      fc.constantFrom(NaN, Infinity, -Infinity, 0, 60, 60.5, 2_958_466, 1 - 1e-12),
    );
    fc.assert(fc.property(serial, (s) => {
      const r = outcome(() => serialToWallClock(s));
      const inRange = Number.isFinite(s) && s >= 1 && s < 2_958_466 && Math.floor(s) !== 60;
      if (!inRange) { expect(r.ok, `${s}`).toBe(false); return; }
      if (!r.ok) {
        // only the rounding of the very last minute of 9999-12-31 may be refused
        expect(s).toBeGreaterThan(2_958_465.999);
        return;
      }
      expect(r.value.date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
      expect(r.value.minutes).toBeGreaterThanOrEqual(0);
      expect(r.value.minutes).toBeLessThan(1440);
      // exactly at half a minute the two roundings may differ by float error: skip only those
      if (Math.abs(((s * 1440) % 1) - 0.5) > 1e-6) expect(r.value).toEqual(reference(s));
      if (s >= 61) expect(Math.abs(wallClockToSerial(r.value) - s)).toBeLessThanOrEqual(0.5 / 1440 + 1e-9);
    }), params(2000, 6));
  });
});

describe('inferResolution(sortedTimes)', () => {
  // Reference: the most common step between neighbours, the smaller one on a tie (its doc comment).
  const mode = (t: number[]) => {
    const counts = new Map<number, number>();
    for (let i = 1; i < t.length; i++) counts.set(t[i] - t[i - 1], (counts.get(t[i] - t[i - 1]) ?? 0) + 1);
    return [...counts].sort((a, b) => b[1] - a[1] || a[0] - b[0])[0][0] / 60_000;
  };
  const steps = fc.array(fc.oneof(
    fc.constantFrom(15, 30, 60).map((m) => m * 60_000),
    fc.constantFrom(0, 1, 45, 120, 1440, -60).map((m) => m * 60_000),
    fc.integer({ min: -1e7, max: 1e9 }),
  ), { maxLength: 60 });

  it('returns the most common step when it is 15, 30 or 60 minutes and refuses anything else', () => {
    fc.assert(fc.property(fc.integer({ min: -1e12, max: 1e13 }), steps, (t0, gaps) => {
      const times = [t0];
      for (const g of gaps) times.push(times[times.length - 1] + g);
      const r = outcome(() => inferResolution(times));
      if (times.length < 2) { expect(r.ok).toBe(false); return; }
      const m = mode(times);
      if ([15, 30, 60].includes(m)) expect(r).toEqual({ ok: true, value: m });
      else expect(r.ok).toBe(false);
    }), params(1500, 7));
  });
});

it('close() accepts rounding but not a real difference', () => {
  expect(close(1 + 1e-12, 1)).toBe(true);
  expect(close(1.001, 1)).toBe(false);
});
