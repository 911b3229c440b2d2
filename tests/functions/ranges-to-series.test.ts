import { describe, expect, it } from 'vitest';
import { seriesFromRanges } from '../../src/functions/ranges-to-series';

const zone = 'Europe/Berlin';
const day = 45658; // 2025-01-01, Berlin clocks at UTC+1
const times = (n: number) => Array.from({ length: n }, (_, h) => [day + h / 24]);
const t0 = Date.UTC(2024, 11, 31, 23);

describe('seriesFromRanges', () => {
  it('seriesFromRanges(times, prices) builds the hourly series, empty prices unknown', () => {
    const { series } = seriesFromRanges({ times: times(4), prices: [[10], [''], [12], [13]] }, { zone });
    expect(series.resolution).toBe(60);
    expect(series.times).toEqual([0, 1, 2, 3].map((h) => t0 + h * 3_600_000));
    expect(series.price[0]).toBe(10);
    expect(series.price[1]).toBeNaN();
  });

  it('skips a title row and trailing rows with neither timestamp nor price', () => {
    const { series } = seriesFromRanges({ times: [['timestamp'], ...times(3), [''], ['']], prices: [['price'], [1], [2], [3], [''], ['']] }, { zone });
    expect(series.price).toEqual([1, 2, 3]);
  });

  it('refuses a price without a timestamp, and a repeated period, naming rows', () => {
    expect(() => seriesFromRanges({ times: [...times(2), ['']], prices: [[1], [2], [3]] }, { zone })).toThrow(/row 3, column "times": has a price but no timestamp/);
    expect(() => seriesFromRanges({ times: [...times(2), [day]], prices: [[1], [2], [3]] }, { zone })).toThrow(/times rows 1 and 3 are the same delivery period/);
  });

  it('puts drivers on the rows of times, in the model\'s order without titles', () => {
    const { series } = seriesFromRanges({ times: times(3), prices: [[1], [2], ['']], drivers: [[5, 50], [6, 60], [7, 70]] }, { zone, driverNames: ['temp', 'load'] });
    expect(series.drivers.temp).toEqual([5, 6, 7]);
    expect(series.drivers.load).toEqual([50, 60, 70]);
  });

  it('matches titled driver columns by name, whatever their order and case', () => {
    const { series } = seriesFromRanges(
      { times: [['when'], ...times(2)], prices: [['price'], [1], [2]], drivers: [['LOAD', 'temp', 'other'], [50, 5, 0], [60, 6, 0]] },
      { zone, driverNames: ['temp', 'load'] },
    );
    expect(series.drivers).toEqual({ temp: [5, 6], load: [50, 60] });
  });

  it('joins drivers with their own driverTimes onto the price rows', () => {
    const { series } = seriesFromRanges({ times: times(2), prices: [[1], [2]], driverTimes: times(3), drivers: [[5], [6], [7]] }, { zone, driverNames: ['temp'] });
    expect(series.times).toHaveLength(3);
    expect(series.price[2]).toBeNaN();
    expect(series.drivers.temp).toEqual([5, 6, 7]);
  });

  it('refuses driver ranges that do not fit the model or the rows', () => {
    const base = { times: times(2), prices: [[1], [2]] };
    expect(() => seriesFromRanges({ ...base, drivers: [[5, 6], [7, 8]] }, { zone, driverNames: ['temp'] })).toThrow(/drivers has 2 columns but the model uses 1 driver \(temp\)/);
    expect(() => seriesFromRanges({ ...base, drivers: [['wind'], [5], [6]] }, { zone, driverNames: ['temp'] })).toThrow(/no column named "temp"/);
    expect(() => seriesFromRanges({ ...base, drivers: [[5], [6], [7]] }, { zone, driverNames: ['temp'] })).toThrow(/does not line up with times/);
    expect(() => seriesFromRanges({ ...base, driverTimes: times(3), drivers: [[5], [6]] }, { zone, driverNames: ['temp'] })).toThrow(/driverTimes has 3 cells but drivers has 2/);
  });

  it('refuses a zone that is not an IANA name before reading any time', () => {
    expect(() => seriesFromRanges({ times: times(2), prices: [[1], [2]] }, { zone: 'Berlin' })).toThrow(/not an IANA time zone name/);
  });
});
