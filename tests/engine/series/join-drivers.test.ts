import { describe, expect, it } from 'vitest';
import { buildSeries, buildSeriesWithDrivers, parseCsv } from '../../../src/engine';

const ZONE = 'Europe/Berlin';
const HISTORY = 'timestamp,price,load,wind\n2025-10-25T22:00+02:00,50,6000,100\n2025-10-25T23:00+02:00,48,5900,110\n';
// the forecast day's rows: 2025-10-26 has 25 hours (Directive 2000/84/EC); here its first three periods
const TOMORROW_ROWS = ['2025-10-26T00:00+02:00', '2025-10-26T01:00+02:00', '2025-10-26T02:00+02:00', '2025-10-26T02:00+01:00'];
const join = (drivers: string, history = HISTORY) =>
  buildSeriesWithDrivers(parseCsv(history, 'history.csv'), parseCsv(drivers, 'drivers.csv'), { zone: ZONE });

describe('buildSeriesWithDrivers(history, drivers, options)', () => {
  it('gives the series of the one-file form (drivers rows appended with empty prices), whatever the column order and dialect', () => {
    const oneFile = buildSeries(parseCsv(HISTORY + TOMORROW_ROWS.map((t, i) => `${t},,${5800 + i},${90 - i}`).join('\n'), 'one.csv'), { zone: ZONE });
    const drivers = `wind;load\n${TOMORROW_ROWS.map((t, i) => `${90 - i};${5800 + i}`.replace(/^/, `${t};`)).join('\n')}`.replace('wind;load', 'timestamp;wind;load');
    const joined = join(drivers);
    expect(joined.series).toEqual(oneFile.series);
    expect(joined.report).toEqual(oneFile.report);
  });

  it('takes local wall-clock drivers with the repeated hour in row order', () => {
    const local = join('timestamp,load,wind\n2025-10-26 00:00,1,1\n2025-10-26 01:00,2,2\n2025-10-26 02:00,3,3\n2025-10-26 02:00,4,4\n');
    expect(local.series.drivers.load.slice(2)).toEqual([1, 2, 3, 4]);
    expect(local.series.times.slice(2).map((t) => new Date(t).toISOString().slice(11, 16))).toEqual(['22:00', '23:00', '00:00', '01:00']);
  });

  it('accepts an empty price column (or missing markers in it) and replaces an empty prepared history row', () => {
    const prepared = `${HISTORY}2025-10-26T00:00+02:00,,,\n`;
    const r = join('timestamp,price,load,wind\n2025-10-26T00:00+02:00,,5800,90\n2025-10-26T01:00+02:00,NA,5801,89\n', prepared);
    expect(r.series.drivers.load.slice(2)).toEqual([5800, 5801]);
  });

  it.each([
    ['a missing driver column', 'timestamp,load\n2025-10-26T00:00+02:00,1\n', 'drivers.csv: row 1: lacks the driver column "wind" that history.csv has; the drivers file needs timestamp and the same driver columns (load, wind)'],
    ['an extra column', 'timestamp,load,wind,solar\n2025-10-26T00:00+02:00,1,1,1\n', 'drivers.csv: row 1: column "solar" is not a driver column of history.csv (load, wind); the drivers file needs timestamp and the same driver columns'],
    ['a price', 'timestamp,price,load,wind\n2025-10-26T00:00+02:00,50,1,1\n', 'drivers.csv: row 2, column "price": the drivers file gives the forecast day\'s driver forecasts only; leave price empty or drop the column'],
    ['a row not after the last price', 'timestamp,load,wind\n2025-10-25T23:00+02:00,1,1\n', 'drivers.csv: row 2, column "timestamp": "2025-10-25T23:00+02:00" is not after the last price of history.csv (2025-10-25T23:00:00+02:00); the drivers file holds the days still to be forecast'],
    ['no timestamp column', 'time,load,wind\n2025-10-26T00:00+02:00,1,1\n', /drivers\.csv: row 1: the header has no "timestamp" column/],
    ['no rows', 'timestamp,load,wind\n', 'drivers.csv: the file has a header but no data rows'],
    ['a period twice in the drivers file', 'timestamp,load,wind\n2025-10-26T00:00+02:00,1,1\n2025-10-26T00:00+02:00,2,2\n', /drivers\.csv: row 3, column "timestamp": timestamp "2025-10-26T00:00\+02:00" appears twice \(rows 2 and 3\)/],
  ])('refuses %s with file, row and column', (_what, drivers, message) => {
    expect(() => join(drivers)).toThrow(message);
  });

  it('refuses a period whose drivers both files give', () => {
    const both = `${HISTORY}2025-10-26T00:00+02:00,,5800,90\n`;
    expect(() => join('timestamp,load,wind\n2025-10-26T00:00+02:00,1,1\n', both)).toThrow(
      'drivers.csv: row 2, column "timestamp": "2025-10-26T00:00+02:00" also has driver values in history.csv (row 4); give the forecast day\'s drivers in one of the two files',
    );
  });
});
