import { describe, expect, it } from 'vitest';
import { buildSeries, dayFrame, deliveryDays, expandDay, fillFromEarlierDays, parseCsv } from '../../../src/engine';

// hourly Berlin series over the EU change days of 2025 (Directive 2000/84/EC)
function hourly(fromUtc: string, hours: number, price: (k: number) => number) {
  const rows = ['timestamp,price'];
  const t0 = Date.parse(fromUtc);
  for (let k = 0; k < hours; k++) rows.push(`${new Date(t0 + k * 3_600_000).toISOString()},${price(k)}`);
  return buildSeries(parseCsv(rows.join('\n'), 'h.csv'), { zone: 'Europe/Berlin' }).series;
}

describe('dayMatrix(values, days, slots) on daylight-saving days', () => {
  it('interpolates the skipped 02:00 slot of a 23-hour day from 01:00 and 03:00', () => {
    const series = hourly('2025-03-29T23:00:00Z', 23, (k) => k * 10); // local 2025-03-30
    const [day] = deliveryDays(series);
    expect(day.count).toBe(23);
    const [row] = dayFrame(series).price;
    expect(row[1]).toBe(10); // 01:00
    expect(row[3]).toBe(20); // 03:00 is the third period
    expect(row[2]).toBe(15); // skipped slot: mean of its neighbours
    expect(expandDay(day, row)).toHaveLength(23);
  });

  it('averages the repeated 02:00 of a 25-hour day into one slot and spreads it back to both', () => {
    const series = hourly('2025-10-25T22:00:00Z', 25, (k) => k); // local 2025-10-26
    const [day] = deliveryDays(series);
    expect(day.count).toBe(25);
    const [row] = dayFrame(series).price;
    expect(row[2]).toBe((2 + 3) / 2);
    expect(row[3]).toBe(4);
    const back = expandDay(day, row);
    expect(back).toHaveLength(25);
    expect(back[2]).toBe(2.5);
    expect(back[3]).toBe(2.5);
  });

  it('leaves slots of a day cut by the data edge unknown', () => {
    const series = hourly('2025-01-01T05:00:00Z', 4, () => 1);
    const [row] = dayFrame(series).price;
    expect(Number.isNaN(row[0])).toBe(true);
    expect(row[6]).toBe(1);
  });
});

describe('fillFromEarlierDays(rows)', () => {
  it('takes the same slot of the nearest earlier day and never looks ahead', () => {
    const rows = [Float64Array.from([NaN, 2]), Float64Array.from([1, NaN]), Float64Array.from([NaN, NaN]), Float64Array.from([5, 6])];
    expect(fillFromEarlierDays(rows)).toBe(3);
    expect(rows.map((r) => Array.from(r))).toEqual([[NaN, 2], [1, 2], [1, 2], [5, 6]]);
  });
});
