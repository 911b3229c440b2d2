import { describe, expect, it } from 'vitest';
import {
  addDays, baselineModel, dayStartUtc, forecastAhead, InputError,
  type DayAheadModel, type DayFrame, type Series,
} from '../../../src/engine';

/** Hourly series over local days from..from+days-1; price(k) for period k (NaN = empty), drivers likewise. */
function hourly(zone: string, from: string, days: number, price: (k: number) => number, drivers: Record<string, (k: number) => number> = {}): Series {
  const times: number[] = [];
  for (let t = dayStartUtc(from, zone); t < dayStartUtc(addDays(from, days), zone); t += 3_600_000) times.push(t);
  return {
    times, price: times.map((_, k) => price(k)), resolution: 60, zone,
    drivers: Object.fromEntries(Object.entries(drivers).map(([name, f]) => [name, times.map((_, k) => f(k))])),
  };
}

/** A model that forecasts D-1 + 1 by slot and records the target day of every view it sees. */
function plusOne(): DayAheadModel & { seen: number[] } {
  const seen: number[] = [];
  return {
    name: 'plus-one', minHistoryDays: 1, seen, fit() {},
    predict(view: DayFrame) {
      seen.push(view.price.length);
      const point = view.price[view.price.length - 1].map((v) => v + 1);
      return { point, lower: point.map((v) => v - 2), upper: point.map((v) => v + 2) };
    },
  };
}

const BERLIN = 'Europe/Berlin';

describe('forecastAhead(model, series, drivers) with driver columns', () => {
  // 14 days of history, then the rows of 2025-01-15 with the load filled in and the price empty
  const priced = 14 * 24;
  const series = hourly(BERLIN, '2025-01-01', 15, (k) => (k < priced ? 40 + (k % 24) : NaN), { load: (k) => 50 + (k % 24) });

  it('forecasts exactly the open day, period by period, with the bands of the model', () => {
    const model = plusOne();
    const { rows, days, notes } = forecastAhead(model, series, ['load']);
    expect(days).toEqual(['2025-01-15']);
    expect(model.seen).toEqual([14]);
    expect(rows.map((r) => r.time)).toEqual(series.times.slice(priced));
    expect(rows.map((r) => r.forecast)).toEqual(Array.from({ length: 24 }, (_, h) => 41 + h));
    expect(rows.map((r) => r.upper - r.lower)).toEqual(new Array(24).fill(4));
    expect(notes).toEqual([]);
  });

  // BUG (reported to the lead): inputFrame fills the empty driver rows of 2025-01-16 from 2025-01-15,
  // so forecastAhead forecasts 2025-01-16 too, on the previous day's load, instead of stopping.
  it('does not forecast later rows whose drivers are empty', () => {
    const longer = hourly(BERLIN, '2025-01-01', 16, (k) => (k < priced ? 40 : NaN), { load: (k) => (k < 15 * 24 ? 50 : NaN) });
    expect(forecastAhead(plusOne(), longer, ['load']).days).toEqual(['2025-01-15']);
  });

  it('forecasts further days with driver rows (a weekend ahead) from the forecasts before them, and says so', () => {
    const weekend = hourly(BERLIN, '2025-01-01', 17, (k) => (k < priced ? 40 : NaN), { load: () => 50 });
    const { rows, days, notes } = forecastAhead(plusOne(), weekend, ['load']);
    expect(days).toEqual(['2025-01-15', '2025-01-16', '2025-01-17']);
    expect(rows.map((r) => r.forecast)).toEqual([...new Array(24).fill(41), ...new Array(24).fill(42), ...new Array(24).fill(43)]);
    expect(notes).toEqual(['2025-01-16, 2025-01-17 use the forecasts of the days before them as their price history']);
  });

  it('refuses with a clear message when the rows of the next day are missing', () => {
    const history = hourly(BERLIN, '2025-01-01', 14, (k) => 40 + (k % 24), { load: () => 50 });
    expect(() => forecastAhead(plusOne(), history, ['load'])).toThrow(InputError);
    expect(() => forecastAhead(plusOne(), history, ['load'])).toThrow(
      'the forecast for 2025-01-15 needs its rows: timestamps of that day with load filled in and price left empty');
  });

  // BUG (reported to the lead): inputFrame fills the empty driver rows from the day before, so the
  // check in forecastAhead never sees an empty driver and it forecasts on yesterday's load silently.
  it('refuses when the next day has rows but its driver is empty', () => {
    const empty = hourly(BERLIN, '2025-01-01', 15, (k) => (k < priced ? 40 : NaN), { load: (k) => (k < priced ? 50 : NaN) });
    expect(() => forecastAhead(plusOne(), empty, ['load'])).toThrow(/the forecast for 2025-01-15 needs its rows/);
  });

  it('refuses a series without any known price', () => {
    const none = hourly(BERLIN, '2025-01-01', 3, () => NaN, { load: () => 50 });
    expect(() => forecastAhead(plusOne(), none, ['load'])).toThrow('there is no known price to forecast from');
  });

  it('notes a partial last day and forecasts the day after it', () => {
    const partial = hourly(BERLIN, '2025-01-01', 15, (k) => (k < priced - 10 ? 40 : NaN), { load: () => 50 });
    const { days, notes } = forecastAhead(plusOne(), partial, ['load']);
    expect(days).toEqual(['2025-01-15']);
    expect(notes).toEqual(['2025-01-14, the last day with prices, has 14 of 24; its other periods take the same period of the day before']);
  });
});

describe('forecastAhead(model, series, []) without drivers', () => {
  it('forecasts the next local day even with no rows for it', () => {
    const history = hourly(BERLIN, '2025-01-01', 14, (k) => 40 + (k % 24));
    const { rows, days } = forecastAhead(baselineModel('naive-day'), history, []);
    expect(days).toEqual(['2025-01-15']);
    expect(rows).toHaveLength(24);
    expect(rows[0].time).toBe(Date.parse('2025-01-14T23:00:00Z')); // 00:00 CET
    expect(rows.map((r) => r.forecast)).toEqual(Array.from({ length: 24 }, (_, h) => 40 + h));
    expect(rows.every((r) => Number.isNaN(r.lower) && Number.isNaN(r.upper))).toBe(true);
  });

  it('gives the 23 periods of the day the clocks go forward (2025-03-30, Directive 2000/84/EC)', () => {
    const history = hourly(BERLIN, '2025-03-15', 15, (k) => k % 24); // through 2025-03-29
    const { rows, days } = forecastAhead(baselineModel('naive-day'), history, []);
    expect(days).toEqual(['2025-03-30']);
    expect(rows).toHaveLength(23);
    expect(rows[0].time).toBe(Date.parse('2025-03-29T23:00:00Z'));
    expect(rows[2].time).toBe(Date.parse('2025-03-30T01:00:00Z')); // 03:00 CEST follows 01:00 CET
    // naive-day by clock slot: 00, 01, then 03..23 of the day before (the 02:00 slot does not exist)
    expect(rows.map((r) => r.forecast)).toEqual([0, 1, ...Array.from({ length: 21 }, (_, h) => h + 3)]);
  });

  it('gives the 25 periods of the day the clocks go back (2025-10-26)', () => {
    const history = hourly(BERLIN, '2025-10-12', 14, (k) => k % 24); // through 2025-10-25
    const { rows, days } = forecastAhead(baselineModel('naive-day'), history, []);
    expect(days).toEqual(['2025-10-26']);
    expect(rows).toHaveLength(25);
    expect(rows.map((r) => r.forecast).slice(0, 5)).toEqual([0, 1, 2, 2, 3]); // the repeated 02:00 takes slot 2 twice
  });

  it('finds the next local day when the last price falls on the next UTC date (New York, 23-hour 2025-03-09)', () => {
    // US DST: 15 U.S.C. 260a, second Sunday of March; the last price 2025-03-08 23:00 EST is 2025-03-09T04:00Z
    const history = hourly('America/New_York', '2025-02-22', 15, () => 30);
    expect(new Date(history.times.at(-1)!).toISOString()).toBe('2025-03-09T04:00:00.000Z');
    const { rows, days } = forecastAhead(baselineModel('naive-day'), history, []);
    expect(days).toEqual(['2025-03-09']);
    expect(rows).toHaveLength(23);
  });

  it('ignores empty rows after the last price and notes a partial last day', () => {
    const s = hourly(BERLIN, '2025-01-01', 16, (k) => (k < 14 * 24 - 12 ? 40 : NaN)); // prices end at 11:00 on 2025-01-14
    const { rows, days, notes } = forecastAhead(baselineModel('naive-day'), s, []);
    expect(days).toEqual(['2025-01-15']);
    expect(rows).toHaveLength(24);
    expect(notes).toEqual(['2025-01-14, the last day with prices, has 12 of 24; its other periods take the same period of the day before']);
  });
});
