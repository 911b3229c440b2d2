import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DateTime } from 'luxon';
import { localTimestamp } from '../../../src/engine/demo/local-timestamp';

describe('localTimestamp(date, clockMinutes, offsetMinutes)', () => {
  it('writes the data-file form: date, time with seconds, signed offset', () => {
    expect(localTimestamp('2025-03-30', 180, 120)).toBe('2025-03-30T03:00:00+02:00');
    expect(localTimestamp('2025-10-05', 195, 630)).toBe('2025-10-05T03:15:00+10:30');
    expect(localTimestamp('2025-11-02', 1425, -420)).toBe('2025-11-02T23:45:00-07:00');
    expect(localTimestamp('2025-01-01', 0, 0)).toBe('2025-01-01T00:00:00+00:00');
  });

  it('agrees with luxon toISO (general-purpose library) for any instant in several zones', () => {
    const zones = ['Europe/Berlin', 'Australia/Adelaide', 'America/Denver', 'Asia/Kolkata', 'UTC'];
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(2000, 0, 1) / 60_000, max: Date.UTC(2040, 0, 1) / 60_000 }),
        fc.constantFrom(...zones),
        (minute, zone) => {
          const t = DateTime.fromMillis(minute * 60_000, { zone });
          const expected = t.toISO({ suppressMilliseconds: true })!.replace(/Z$/, '+00:00');
          expect(localTimestamp(t.toISODate()!, t.hour * 60 + t.minute, t.offset)).toBe(expected);
        },
      ),
    );
  });

  it('parses back to the same instant with Date.parse', () => {
    const text = localTimestamp('2026-04-05', 150, 630);
    expect(Date.parse(text)).toBe(Date.UTC(2026, 3, 4, 16, 0));
  });
});
