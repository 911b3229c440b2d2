import { describe, expect, it } from 'vitest';
import { readDate, readTimes } from '../../src/functions/timestamps';

const BERLIN = 'Europe/Berlin';
const H = 3_600_000;

describe('readTimes', () => {
  it('readTimes([serial]) reads a 1900-system serial as wall-clock time in the zone', () => {
    // 45658 is 2025-01-01 (ECMA-376 Part 1 §18.17.4.1: serial 61 = 1900-03-01, whole days on from there);
    // Berlin is UTC+1 in January, so local midnight is 23:00 UTC the day before
    expect(readTimes([45658, 45658.5], BERLIN, 'times')).toEqual([Date.UTC(2024, 11, 31, 23), Date.UTC(2025, 0, 1, 11)]);
  });

  it('readTimes(cells, zone, what, "1904") shifts 1904-system serials by 1462 days', () => {
    // the 1904 system counts from 1904-01-01, 1462 days after the 1900 system's base (ECMA-376 §18.17.4.1)
    expect(readTimes([45658 - 1462], BERLIN, 'times', '1904')).toEqual(readTimes([45658], BERLIN, 'times'));
  });

  it('readTimes takes the second 02:00 of the autumn change day as the later instant', () => {
    // EU summer time ends at 01:00 UTC on the last Sunday of October (Directive 2000/84/EC): 2025-10-26
    const day = 45956; // 2025-10-26
    const cells = [0, 1, 2, 2, 3].map((h) => day + h / 24);
    expect(readTimes(cells, BERLIN, 'times')).toEqual([
      Date.UTC(2025, 9, 25, 22), Date.UTC(2025, 9, 25, 23), Date.UTC(2025, 9, 26, 0), Date.UTC(2025, 9, 26, 1), Date.UTC(2025, 9, 26, 2),
    ]);
  });

  it('readTimes refuses a time in the hour the clocks skip (spring forward)', () => {
    // 2025-03-30: 02:00–03:00 does not exist in Berlin
    expect(() => readTimes([45746 + 2.5 / 24], BERLIN, 'times')).toThrow(/row 1, column "times".*does not exist/);
  });

  it('readTimes reads ISO text with a UTC offset as an exact instant', () => {
    expect(readTimes(['2025-03-30T03:00:00+02:00', '2025-03-30T01:00:00Z'], BERLIN, 'times')).toEqual([Date.UTC(2025, 2, 30, 1), Date.UTC(2025, 2, 30, 1)]);
  });

  it('readTimes refuses an offset that is not the zone\'s own at that instant', () => {
    expect(() => readTimes(['2025-01-15T10:00:00+02:00'], BERLIN, 'times')).toThrow(/not a local time of Europe\/Berlin/);
  });

  it('readTimes reads text without an offset as wall-clock time, with the same autumn rule', () => {
    const t = readTimes(['2025-10-26 02:00', '2025-10-26T02:00', '2025-10-27'], BERLIN, 'times');
    expect(t).toEqual([Date.UTC(2025, 9, 26, 0), Date.UTC(2025, 9, 26, 1), Date.UTC(2025, 9, 26, 23)]);
    expect(t[1]! - t[0]!).toBe(H);
  });

  it('readTimes gives undefined for an empty cell and refuses other text with its row', () => {
    expect(readTimes(['', null], BERLIN, 'times')).toEqual([undefined, undefined]);
    expect(() => readTimes([45658, 'tomorrow'], BERLIN, 'times')).toThrow(/row 2, column "times": "tomorrow" is not a timestamp/);
    expect(() => readTimes([true], BERLIN, 'times')).toThrow(/TRUE is not a timestamp/);
    expect(() => readTimes(['2025-01-01 10:00:30'], BERLIN, 'times')).toThrow(/seconds/);
    expect(() => readTimes(['2025-02-30 10:00'], BERLIN, 'times')).toThrow(/row 1, column "times": "2025-02-30" is not a calendar date/);
  });

  it('readTimes numbers rows from firstRow', () => {
    expect(() => readTimes(['x'], BERLIN, 'times', '1900', 2)).toThrow(/row 2/);
  });
});

describe('readDate', () => {
  it('readDate(serial) is the serial\'s calendar day, time ignored', () => {
    expect(readDate(45933.75, 'date')).toBe('2025-10-03');
  });

  it('readDate(text) takes the date part as written', () => {
    expect(readDate('2025-10-03', 'date')).toBe('2025-10-03');
    expect(readDate('2025-10-03T23:30:00-05:00', 'date')).toBe('2025-10-03');
  });

  it('readDate refuses empty cells and other text', () => {
    expect(() => readDate('', 'date')).toThrow(/is empty/);
    expect(() => readDate('3 Oct', 'date')).toThrow(/not a date/);
  });
});
