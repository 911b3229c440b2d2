import { describe, expect, it } from 'vitest';
import { timestampReader } from '../../../src/engine';

const BERLIN = 'Europe/Berlin';
const where = (row: number) => ({ file: 'f.csv', row, column: 'timestamp' });

// EU summer time ends at 01:00 UTC on the last Sunday of October and begins at 01:00 UTC on the
// last Sunday of March (Directive 2000/84/EC, Art. 2 and 3): 2025-10-26 and 2025-03-30.
describe('timestampReader(zone).text(text, where)', () => {
  it('reads local wall-clock text in the zone: space or T, with or without :00 seconds, a bare date as midnight', () => {
    const read = timestampReader(BERLIN);
    expect(read.text('2025-01-15 10:00')).toBe(Date.UTC(2025, 0, 15, 9));
    expect(read.text('2025-07-15T10:00')).toBe(Date.UTC(2025, 6, 15, 8));
    expect(read.text('2025-07-15T10:15:00')).toBe(Date.UTC(2025, 6, 15, 8, 15));
    expect(read.text('2025-07-15T10:30:00.000')).toBe(Date.UTC(2025, 6, 15, 8, 30));
    expect(read.text('2025-07-16')).toBe(Date.UTC(2025, 6, 15, 22));
  });

  it('reads the repeated 02:00 of the autumn change in row order: first the summer-time instant, then the winter-time one', () => {
    const read = timestampReader(BERLIN);
    const times = ['2025-10-26 01:00', '2025-10-26 02:00', '2025-10-26 02:00', '2025-10-26 03:00'].map((t, i) => read.text(t, where(i + 2)));
    expect(times).toEqual([Date.UTC(2025, 9, 25, 23), Date.UTC(2025, 9, 26, 0), Date.UTC(2025, 9, 26, 1), Date.UTC(2025, 9, 26, 2)]);
    expect(read.firstRepeated).toEqual(where(3));
  });

  it('does the same for quarter-hours: 02:00..02:45 twice', () => {
    const read = timestampReader(BERLIN);
    const wall = ['02:00', '02:15', '02:30', '02:45', '02:00', '02:15', '02:30', '02:45'].map((h) => read.text(`2025-10-26 ${h}`));
    expect(wall.map((t) => (t - Date.UTC(2025, 9, 26, 0)) / 900_000)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
  });

  it('refuses a time in the skipped spring hour, naming row and column', () => {
    const read = timestampReader(BERLIN);
    expect(read.text('2025-03-30 01:00')).toBe(Date.UTC(2025, 2, 30, 0));
    expect(() => read.text('2025-03-30 02:00', where(7))).toThrow('f.csv: row 7, column "timestamp": 2025-03-30 02:00 does not exist in Europe/Berlin (the clocks skip it)');
    expect(read.text('2025-03-30 03:00')).toBe(Date.UTC(2025, 2, 30, 1));
  });

  it('reads a wall clock handed over directly (a cell serial) with the same rule', () => {
    const read = timestampReader(BERLIN);
    expect(read.wall({ date: '2025-10-26', minutes: 120 })).toBe(Date.UTC(2025, 9, 26, 0));
    expect(read.text('2025-10-26 02:00')).toBe(Date.UTC(2025, 9, 26, 1));
  });

  it('reads text with a UTC offset as an exact instant, in any offset unless the zone\'s own is asked for', () => {
    expect(timestampReader(BERLIN).text('2025-07-15T10:00:00-04:00')).toBe(Date.UTC(2025, 6, 15, 14));
    expect(timestampReader(BERLIN).text('2025-07-15T10:00Z')).toBe(Date.UTC(2025, 6, 15, 10));
    const own = timestampReader(BERLIN, { zoneOffsetsOnly: true });
    expect(own.text('2025-07-15T10:00:00+02:00')).toBe(Date.UTC(2025, 6, 15, 8));
    expect(own.text('2025-07-15T10:00:00+00:00')).toBe(Date.UTC(2025, 6, 15, 10));
    expect(() => own.text('2025-07-15T10:00:00+01:00', where(4))).toThrow(/row 4, column "timestamp": "2025-07-15T10:00:00\+01:00" is not a local time of Europe\/Berlin/);
  });

  it.each([
    ['01.01.2025 00:00', /is not a timestamp; write it like 2025-03-30T03:00:00\+02:00 or 2025-03-30T01:00:00Z, or as local time of Europe\/Berlin like 2025-03-30 03:00/],
    ['', /"" is not a timestamp/],
    ['2025-01-01 10:00:30', /has seconds/],
    ['2025-01-01 24:00', /is not a time of day/],
    ['2025-01-01 10:60', /is not a time of day/],
    ['2025-02-30 10:00', /"2025-02-30" is not a calendar date/],
    ['2025-02-30T10:00Z', /day 30 out of range/],
  ])('refuses %j with its row', (text, message) => {
    expect(() => timestampReader(BERLIN).text(text, where(9))).toThrow(message);
    expect(() => timestampReader(BERLIN).text(text, where(9))).toThrow(/^f\.csv: row 9, column "timestamp": /);
  });
});
