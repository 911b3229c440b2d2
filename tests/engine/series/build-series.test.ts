import { describe, expect, it } from 'vitest';
import { buildSeries, describeIngest, InputError, parseCsv } from '../../../src/engine';

const build = (text: string, target = 'price') => buildSeries(parseCsv(text, 'f.csv'), { zone: 'Europe/Berlin', target });

describe('buildSeries(table, options)', () => {
  it('reads timestamps, prices (negative and zero included) and drivers', () => {
    const { series, report } = build('timestamp,price,wind\n2025-01-01T00:00:00+01:00,-5.5,3\n2025-01-01T01:00:00+01:00,0,\n');
    expect(series.resolution).toBe(60);
    expect(series.price).toEqual([-5.5, 0]);
    expect(series.drivers.wind).toEqual([3, NaN]);
    expect(series.times[0]).toBe(Date.parse('2024-12-31T23:00:00Z'));
    expect(report.missingPrices).toBe(0);
  });

  it('turns missing rows into reported gaps of unknown values', () => {
    const { series, report } = build('timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,2\n2025-01-01T04:00Z,5\n2025-01-01T05:00Z,6\n');
    expect(series.price).toEqual([1, 2, NaN, NaN, 5, 6]);
    expect(report.gaps).toEqual([{ from: Date.parse('2025-01-01T02:00Z'), periods: 2 }]);
    expect(report.missingPrices).toBe(2);
    expect(describeIngest(series, report).join('\n')).toMatch(/1 gap, 2 periods with no row/);
  });

  it('sorts rows that are out of order and says so', () => {
    const { series, report } = build('timestamp,price\n2025-01-01T01:00Z,2\n2025-01-01T00:00Z,1\n2025-01-01T02:00Z,3\n');
    expect(series.price).toEqual([1, 2, 3]);
    expect(report.outOfOrderRows).toBe(1);
  });

  it('does not count empty prices after the last known one as missing (they are forecast rows)', () => {
    const { report } = build('timestamp,price,t\n2025-01-01T00:00Z,1,1\n2025-01-01T01:00Z,2,1\n2025-01-01T02:00Z,,1\n');
    expect(report.missingPrices).toBe(0);
  });

  it('infers 15-minute resolution', () => {
    const { series } = build('timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T00:15Z,2\n2025-01-01T00:30Z,3\n');
    expect(series.resolution).toBe(15);
  });

  it.each([
    ['text in price', 'timestamp,price\n2025-01-01T00:00Z,abc\n2025-01-01T01:00Z,1\n', /f\.csv: row 2, column "price": "abc" is not a number/],
    ['duplicate timestamps', 'timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T00:00Z,2\n', /row 3, column "timestamp".*appears twice \(rows 2 and 3\)/],
    ['no header', '2025-01-01T00:00Z,1\n', /header has no "timestamp" column/],
    ['no price column', 'timestamp,cost\n2025-01-01T00:00Z,1\n', /header has no "price" column/],
    ['a timestamp that is none', 'timestamp,price\n2025-01-01 00:00,1\n01.01.2025 01:00,1\n', /row 3, column "timestamp": "01.01.2025 01:00" is not a timestamp; write it like 2025-03-30T03:00:00\+02:00 or 2025-03-30T01:00:00Z, or as local time of Europe\/Berlin like 2025-03-30 03:00/],
    ['an impossible date', 'timestamp,price\n2025-02-30T00:00Z,1\n2025-03-01T01:00Z,1\n', /day 30 out of range/],
    ['an empty file', '', /the file is empty/],
    ['a header only', 'timestamp,price\n', /no data rows/],
    ['a text driver column', 'timestamp,price,zone\n2025-01-01T00:00Z,1,north\n2025-01-01T01:00Z,1,north\n', /column "zone": "north" is not a number/],
    ['a ragged row', 'timestamp,price\n2025-01-01T00:00Z,1,7\n', /row 2: has 3 cells but the header has 2 columns/],
    ['a 20-minute step', 'timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T00:20Z,1\n2025-01-01T00:40Z,1\n', /20 minutes apart/],
    ['an off-grid period', 'timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,1\n2025-01-01T02:30Z,1\n', /row 4.*grid/],
    ['Infinity', 'timestamp,price\n2025-01-01T00:00Z,Infinity\n2025-01-01T01:00Z,1\n', /"Infinity" is not a number/],
    ['two columns of one name', 'timestamp,price,t,T\n2025-01-01T00:00Z,1,1,1\n', /names column "T" twice/],
  ])('refuses %s with one clear line', (_what, text, message) => {
    expect(() => build(text)).toThrow(InputError);
    expect(() => build(text)).toThrow(message);
  });

  it('refuses an unknown time zone', () => {
    expect(() => buildSeries(parseCsv('timestamp,price\n2025-01-01T00:00Z,1\n', 'f'), { zone: 'Mars/Olympus' })).toThrow(/IANA time zone/);
  });
});

describe('buildSeries(table, options) with hostile header names and line breaks in cells (found by tests/fuzz/csv-ingest)', () => {
  it('refuses a column named __proto__, which vanished from the drivers (it set their prototype)', () => {
    expect(() => build('timestamp,price,__proto__\n2025-01-01T00:00Z,1,2\n2025-01-01T01:00Z,1,2\n')).toThrow(/"__proto__" is reserved/);
    expect(() => build('timestamp,price,constructor\n2025-01-01T00:00Z,1,2\n2025-01-01T01:00Z,1,2\n')).toThrow(/reserved/);
  });

  it('keeps every message on one line when a quoted header holds a line break', () => {
    expect(() => build('"time\nstamp",price\n2025-01-01T00:00Z,1\n')).toThrow(/^[^\n]*no "timestamp" column[^\n]*\\n[^\n]*$/);
    expect(() => build('timestamp,price,"wind\r\nspeed"\n2025-01-01T00:00Z,1,2\n')).toThrow(/^[^\r\n]*line break[^\r\n]*$/);
    expect(() => build('timestamp,price\n"2025-01-01T00:00\n+00:00",1\n2025-01-01T00:00Z,2\n')).toThrow(/^[^\n]*appears twice[^\n]*$/);
  });
});

describe('buildSeries(table, options) with a timestamp years away from the rest (found by tests/fuzz/csv-ingest)', () => {
  it('refuses a span beyond MAX_PERIODS at once, naming the rows (a row in 9999 made 7*10^7 periods and ran for minutes)', () => {
    const text = 'timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,2\n2025-01-01T02:00Z,2\n9999-01-01T02:00Z,2\n';
    // how fast it refuses is measured in npm run bench (bench/engine-speed.ts), not asserted here
    expect(() => build(text)).toThrow(/span \d+ periods of 60 minutes, from row 2 to row 5/);
  });

  it('still reads a long span with gaps below the limit', () => {
    const { series } = build('timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,2\n2026-01-01T00:00Z,3\n');
    expect(series.times).toHaveLength(8761);
  });
});

describe('buildSeries(table, options) on the dialects desks export', () => {
  it('reads the numbers of a ;-file with decimal commas as the plain file\'s, bit for bit', () => {
    const plain = build('timestamp,price,load\n2025-01-01T00:00Z,41.25,6012.5\n2025-01-01T01:00Z,-0.07,5999\n');
    const comma = build('timestamp;price;load\n2025-01-01T00:00Z;41,25;6.012,5\n2025-01-01T01:00Z;-0,07;5.999\n');
    expect(comma.series).toEqual(plain.series);
  });

  it('reads missing markers as unknown, counts them and reports them like empty cells', () => {
    const { series, report } = build('timestamp,price,wind\n2025-01-01T00:00Z,1,NA\n2025-01-01T01:00Z,#N/A,-\n2025-01-01T02:00Z,3,\n');
    expect(series.price).toEqual([1, NaN, 3]);
    expect(series.drivers.wind).toEqual([NaN, NaN, NaN]);
    expect(report.markedUnknown).toBe(3);
    expect(report.missingPrices).toBe(1);
    expect(describeIngest(series, report)).toContain('3 cells held a missing marker such as NA or #N/A and are read as unknown, like empty cells');
  });

  it('keeps missing markers for data files: a table built from sheet ranges (no dialect) still refuses "NA"', () => {
    const table = { source: 'History', header: ['timestamp', 'price'], rows: [['2025-01-01T00:00Z', '1'], ['2025-01-01T01:00Z', 'NA']], rowNumbers: [2, 3] };
    expect(() => buildSeries(table, { zone: 'Europe/Berlin' })).toThrow('History: row 3, column "price": "NA" is not a number');
  });

  it('reads local wall-clock timestamps over the 25-hour day of 2025-10-26 (Directive 2000/84/EC) as the file with offsets', () => {
    const local = build('timestamp,price\n2025-10-26 01:00,1\n2025-10-26 02:00,2\n2025-10-26 02:00,3\n2025-10-26 03:00,4\n');
    const offsets = build('timestamp,price\n2025-10-26T01:00+02:00,1\n2025-10-26T02:00+02:00,2\n2025-10-26T02:00+01:00,3\n2025-10-26T03:00+01:00,4\n');
    expect(local.series).toEqual(offsets.series);
  });

  it('refuses a wall-clock time of the skipped spring hour with row and column', () => {
    expect(() => build('timestamp,price\n2025-03-30 01:00,1\n2025-03-30 02:00,2\n')).toThrow('f.csv: row 3, column "timestamp": 2025-03-30 02:00 does not exist in Europe/Berlin (the clocks skip it)');
  });

  it('refuses a repeated autumn wall-clock time when the rows are not in time order (row order would pick the wrong instant)', () => {
    expect(() => build('timestamp,price\n2025-10-26 03:00,4\n2025-10-26 02:00,3\n2025-10-26 02:00,2\n2025-10-26 01:00,1\n')).toThrow(
      /^f\.csv: row 3, column "timestamp": is a wall-clock time that the autumn clock change repeats, and the rows are not in time order .*sort the rows or give timestamps with their UTC offset$/,
    );
  });

  it('names the separators it reads when the header is one column', () => {
    expect(() => build('timestamp|price\n2025-01-01T00:00Z|1\n')).toThrow(/it has one column: Spotloom reads files separated by , or ; or tab/);
  });
});
