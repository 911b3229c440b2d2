import { describe, expect, it } from 'vitest';
import { timeReader, DATE_1904_OFFSET } from '../../src/pane/logic/cell-time';

const BERLIN = 'Europe/Berlin';

describe('timeReader(zone, dateSystem)', () => {
  it('reads serial 45658 as local midnight of 2025-01-01 in Berlin (UTC+1 in winter)', () => {
    // 45658 = DATE(2025,1,1) in the 1900 date system (ECMA-376 Part 1, 18.17.4.1; from memory)
    expect(timeReader(BERLIN, '1900')(45658, {})).toBe(Date.parse('2025-01-01T00:00:00+01:00'));
  });

  it('reads the same day in the 1904 date system 1462 days lower', () => {
    // the 1904 system counts from 1904-01-01, 1462 days after the 1900 system's day 0 (ECMA-376 Part 1, 18.17.4.1)
    expect(DATE_1904_OFFSET).toBe(1462);
    expect(timeReader(BERLIN, '1904')(45658 - 1462 + 0.5, {})).toBe(Date.parse('2025-01-01T12:00:00+01:00'));
  });

  it('reads numeric text like a number', () => {
    expect(timeReader(BERLIN, '1900')('45658.25', {})).toBe(Date.parse('2025-01-01T06:00:00+01:00'));
  });

  it('gives the repeated autumn hour its earlier instant first and its later instant on the repeat', () => {
    // EU summer time ends on the last Sunday of October at 01:00 UTC (Directive 2000/84/EC): 2025-10-26
    const read = timeReader(BERLIN, '1900');
    const twoAm = 45956 + 2 / 24; // 2025-10-26 02:00 wall clock
    const first = read(twoAm, {});
    const second = read(twoAm, {});
    expect(first).toBe(Date.parse('2025-10-26T02:00:00+02:00'));
    expect(second).toBe(Date.parse('2025-10-26T02:00:00+01:00'));
    expect(second - first).toBe(3_600_000);
  });

  it('refuses a wall time inside the skipped spring hour, naming the row', () => {
    // EU summer time starts on the last Sunday of March at 01:00 UTC: 2025-03-30, 02:00–03:00 local does not exist
    const read = timeReader(BERLIN, '1900');
    expect(() => read(45746 + 2.5 / 24, { file: 'History', row: 7, column: 'timestamp' })).toThrow(/History: row 7, column "timestamp": .*does not exist/);
  });

  it('reads ISO 8601 text with an offset, and local wall-clock text in the zone as data files do', () => {
    const read = timeReader(BERLIN, '1900');
    expect(read('2025-03-30T03:00:00+02:00', {})).toBe(Date.parse('2025-03-30T01:00:00Z'));
    // ISO 8601-1:2019 5.4: without an offset the time is local; 03:00 on 2025-03-30 is CEST (UTC+2)
    expect(read('2025-03-30 03:00', { row: 3 })).toBe(Date.parse('2025-03-30T01:00:00Z'));
    // the repeated autumn hour as text: earlier instant first, then the later one
    expect(read('2025-10-26 02:00', {})).toBe(Date.parse('2025-10-26T02:00:00+02:00'));
    expect(read('2025-10-26 02:00', {})).toBe(Date.parse('2025-10-26T02:00:00+01:00'));
    expect(() => read('2025-03-30 02:30', { row: 9 })).toThrow(/row 9: .*does not exist/);
    expect(() => read('tomorrow', { row: 4 })).toThrow(/row 4: .*not a timestamp/);
  });

  it('refuses a boolean cell', () => {
    expect(() => timeReader(BERLIN, '1900')(true, { row: 2 })).toThrow(/row 2: true is not a timestamp/);
  });

  it('refuses serial 60, the 29 February 1900 that never existed', () => {
    expect(() => timeReader(BERLIN, '1900')(60, { row: 4 })).toThrow(/row 4: serial 60/);
  });
});
