import { beforeAll, describe, expect, it } from 'vitest';
import { formatTimestamp, parseStoredModel, type StoredModel } from '../../src/engine';
import { forecastTomorrow, rowsOfDay } from '../../src/pane/logic/tomorrow';
import { checkedHistory, trainedText } from './support';

let stored: StoredModel;
beforeAll(async () => { stored = parseStoredModel(await trainedText()); });

describe('forecastTomorrow(stored, data)', () => {
  it('forecasts every period of the day after the last known price', async () => {
    const { data } = await checkedHistory(130);
    const { rows, days } = forecastTomorrow(stored, data);
    const open = data.series.times.filter((_, i) => Number.isNaN(data.series.price[i]));
    expect(rows.map((r) => r.time)).toEqual(open);
    expect(days).toEqual([formatTimestamp(open[0], 'Europe/Berlin').slice(0, 10)]);
    expect(rows.every((r) => Number.isFinite(r.forecast))).toBe(true);
  });

  it('refuses data in another time zone than the model was trained for', async () => {
    const { data } = await checkedHistory(130);
    expect(() => forecastTomorrow(stored, { series: { ...data.series, zone: 'Europe/London' } })).toThrow(/trained for time zone Europe\/Berlin, but Data uses Europe\/London/);
  });

  it('refuses data without a driver the model was trained with', async () => {
    const { data } = await checkedHistory(130);
    expect(() => forecastTomorrow(stored, { series: { ...data.series, drivers: {} } })).toThrow(/trained with the driver "load forecast"/);
  });

  it("says which rows are missing when tomorrow's rows are not there", async () => {
    const { data } = await checkedHistory(130, { openDays: 0 });
    expect(() => forecastTomorrow(stored, data)).toThrow(/needs its rows/);
  });
});

describe('rowsOfDay(rows, date, zone)', () => {
  it('keeps the periods of one local day', () => {
    const t = Date.parse('2025-06-01T22:00:00Z'); // 2025-06-02 00:00 in Berlin
    const rows = [t - 3_600_000, t, t + 23 * 3_600_000, t + 24 * 3_600_000].map((time) => ({ time, forecast: 1, lower: 0, upper: 2 }));
    expect(rowsOfDay(rows, '2025-06-02', 'Europe/Berlin').map((r) => r.time)).toEqual([t, t + 23 * 3_600_000]);
  });
});
