import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { formatTimestamp, parseTimestamp } from '../../../src/engine';

describe('formatTimestamp(ms, zone)', () => {
  it('writes ISO 8601 with the local UTC offset (ISO 8601-1:2019, 5.4; EU summer time per Directive 2000/84/EC)', () => {
    expect(formatTimestamp(1743296400000, 'Europe/Berlin')).toBe('2025-03-30T03:00:00+02:00');
    expect(formatTimestamp(Date.parse('2025-03-30T00:00:00Z'), 'Europe/Berlin')).toBe('2025-03-30T01:00:00+01:00');
    expect(formatTimestamp(Date.parse('2025-01-01T00:00:00Z'), 'Asia/Kolkata')).toBe('2025-01-01T05:30:00+05:30');
    expect(formatTimestamp(Date.parse('2025-01-01T00:00:00Z'), 'America/St_Johns')).toBe('2024-12-31T20:30:00-03:30');
  });

  it('tells the two instants of the repeated hour apart by their offsets', () => {
    expect(formatTimestamp(Date.parse('2025-10-26T00:00:00Z'), 'Europe/Berlin')).toBe('2025-10-26T02:00:00+02:00');
    expect(formatTimestamp(Date.parse('2025-10-26T01:00:00Z'), 'Europe/Berlin')).toBe('2025-10-26T02:00:00+01:00');
  });

  it('keeps milliseconds only when there are some', () => {
    expect(formatTimestamp(Date.parse('2025-01-01T00:00:00.123Z'), 'Europe/Berlin')).toBe('2025-01-01T01:00:00.123+01:00');
  });

  it('is read back by parseTimestamp to the same instant in many zones', () => {
    const rng = seedrandom('fmt');
    const zones = ['Europe/Berlin', 'Europe/London', 'America/New_York', 'America/St_Johns', 'Asia/Kathmandu', 'Australia/Lord_Howe', 'Pacific/Chatham', 'UTC'];
    for (let k = 0; k < 400; k++) {
      const ms = Date.parse('2000-01-01T00:00:00Z') + Math.floor(rng() * 40 * 365 * 86_400) * 1000;
      const zone = zones[k % zones.length];
      expect(parseTimestamp(formatTimestamp(ms, zone))).toBe(ms);
    }
  });
});
