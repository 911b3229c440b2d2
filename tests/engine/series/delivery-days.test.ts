import { describe, expect, it } from 'vitest';
import { deliveryDays, type Series } from '../../../src/engine';
import { offsetLookup } from '../../../src/engine/series/zone-offsets';

const quarterHours = (fromIso: string, n: number, zone: string): Series => {
  const t0 = Date.parse(fromIso);
  const times = Array.from({ length: n }, (_, i) => t0 + i * 900_000);
  return { times, price: times.map(() => 1), drivers: {}, resolution: 15, zone };
};

// Offsets from the IANA tz database: Adelaide +10:30 in January (ACDT), Kolkata +05:30 all year,
// Lord Howe +10:30 until 2025-10-05 02:00 local, then +11:00.
describe('deliveryDays(series) in zones whose offset is not a whole hour (found by tests/fuzz/day-frame)', () => {
  it('starts the day at local midnight in Australia/Adelaide (13:30 UTC), not at the UTC hour before it', () => {
    const days = deliveryDays(quarterHours('2025-01-01T00:00:00+10:30', 192, 'Australia/Adelaide'));
    expect(days.map((d) => [d.date, d.count, d.slots[0], d.slots[95]])).toEqual([['2025-01-01', 96, 0, 95], ['2025-01-02', 96, 0, 95]]);
  });

  it('puts 00:00 local in Asia/Kolkata into its own day as slot 0', () => {
    const days = deliveryDays(quarterHours('2025-01-01T23:30:00+05:30', 4, 'Asia/Kolkata'));
    expect(days.map((d) => [d.date, d.slots])).toEqual([['2025-01-01', [94, 95]], ['2025-01-02', [0, 1]]]);
  });

  it('skips the half hour of Australia/Lord_Howe\'s 30-minute spring change, which happens at 15:30 UTC', () => {
    // local 2025-10-05 from 00:00 (+10:30) = 2025-10-04T13:30Z; 02:00 becomes 02:30 (+11:00): 1410 minutes
    const days = deliveryDays(quarterHours('2025-10-04T13:30:00Z', 94, 'Australia/Lord_Howe'));
    expect(days).toHaveLength(1);
    expect(days[0].expected).toBe(94);
    expect(days[0].slots.slice(6, 12)).toEqual([6, 7, 10, 11, 12, 13]); // 01:30 01:45, then 02:30
  });
});

describe('offsetLookup(zone)', () => {
  it('gives the offset on both sides of a change that is not on the UTC hour', () => {
    const at = offsetLookup('Australia/Lord_Howe');
    const change = Date.parse('2025-10-04T15:30:00Z'); // 02:00 local +10:30 becomes 02:30 +11:00
    expect([at(change - 1), at(change), at(change + 3_600_000)]).toEqual([630, 660, 660]);
    expect(offsetLookup('Europe/Berlin')(Date.parse('2025-03-30T01:00:00Z'))).toBe(120);
    expect(offsetLookup('Europe/Berlin')(Date.parse('2025-03-30T00:59:59.999Z'))).toBe(60);
  });
});
