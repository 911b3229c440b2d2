import { describe, expect, it } from 'vitest';
import { buildSeries, buildSeriesWithActuals, parseCsv } from '../../../src/engine';

const ZONE = 'Europe/Berlin';
const prices = buildSeries(parseCsv('timestamp,price\n2025-10-26T00:00+02:00,50\n2025-10-26T01:00+02:00,48\n2025-10-26T02:00+02:00,47\n', 'p.csv'), { zone: ZONE }).series;

describe('buildSeriesWithActuals(forecasts, actuals, options)', () => {
  it('takes the actual column from the prices, matched on the instant, whatever the timestamps\' spelling', () => {
    const issued = parseCsv('timestamp,forecast,lower,upper\n2025-10-25T23:00Z,49,40,60\n2025-10-26 02:00,46,40,55\n2025-10-26T03:00+02:00,45,40,50\n', 'i.csv');
    const { series, unmatched } = buildSeriesWithActuals(issued, prices, { zone: ZONE });
    expect(series.price).toEqual([48, 47, NaN]);
    expect(series.drivers.forecast).toEqual([49, 46, 45]);
    expect(Object.keys(series.drivers)).toEqual(['forecast', 'lower', 'upper']);
    expect(unmatched).toBe(1);
  });

  it('refuses an issued file that has an actual column of its own', () => {
    expect(() => buildSeriesWithActuals(parseCsv('timestamp,actual,forecast\n2025-10-26T00:00+02:00,1,2\n', 'i.csv'), prices, { zone: ZONE }))
      .toThrow('i.csv: row 1, column "actual": has an "actual" column, and the actual prices come from another file too; give them in one place');
  });
});
