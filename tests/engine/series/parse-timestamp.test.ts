import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { InputError, parseTimestamp } from '../../../src/engine';

describe('parseTimestamp(text)', () => {
  it('reads a timestamp with offset or Z (ISO 8601-1:2019, 5.4)', () => {
    expect(parseTimestamp('2025-03-30T03:00:00+02:00')).toBe(Date.parse('2025-03-30T01:00:00Z'));
    expect(parseTimestamp('2025-03-30 01:00Z')).toBe(Date.parse('2025-03-30T01:00:00Z'));
  });

  it('reads years 0000-0099 as those years, not as 1900-1999 (found by tests/fuzz/scalars)', () => {
    // reference: luxon DateTime.fromISO, a general-purpose date library
    expect(parseTimestamp('0025-01-01T00:00:00Z')).toBe(DateTime.fromISO('0025-01-01T00:00:00Z').toMillis());
    expect(parseTimestamp('0007-05-17T02:02:00+06:00')).toBe(DateTime.fromISO('0007-05-17T02:02:00+06:00', { setZone: true }).toMillis());
    // year 0 is a leap year in the proleptic Gregorian calendar (ISO 8601)
    expect(parseTimestamp('0000-02-29T00:00Z')).toBe(DateTime.fromISO('0000-02-29T00:00Z').toMillis());
    expect(() => parseTimestamp('1900-02-29T00:00Z')).toThrow(InputError);
  });

  it('keeps the day when the fraction rounds up to the next second', () => {
    expect(parseTimestamp('0099-12-31T23:59:59.9999Z')).toBe(DateTime.fromISO('0100-01-01T00:00:00Z').toMillis());
  });
});

describe('parseTimestamp(text) refuses offsets out of range', () => {
  it.each(['2025-01-01T00:00-82:62', '2025-01-01T00:00+24:00', '2025-01-01T00:00+0160', '2025-01-01T00:00+99'])(
    '%s (found by tests/fuzz/scalars)', (text) => {
      expect(() => parseTimestamp(text)).toThrow(/UTC offset .* out of range/);
    });

  it('accepts the widest real offsets, +14:00 and -12:00, and +23:59', () => {
    expect(parseTimestamp('2025-01-01T00:00+14:00')).toBe(Date.parse('2024-12-31T10:00:00Z'));
    expect(parseTimestamp('2025-01-01T00:00-1200')).toBe(Date.parse('2025-01-01T12:00:00Z'));
    expect(parseTimestamp('2025-01-01T00:00+23:59')).toBe(Date.parse('2024-12-31T00:01:00Z'));
  });
});
