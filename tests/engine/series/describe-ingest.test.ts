import { describe, expect, it } from 'vitest';
import { buildSeries, describeIngest, parseCsv, type IngestReport, type Series } from '../../../src/engine';

function hourlyRows(fromUtc: string, hours: number, price: (k: number) => string = () => '40') {
  const rows = ['timestamp,price'];
  const t0 = Date.parse(fromUtc);
  for (let k = 0; k < hours; k++) rows.push(`${new Date(t0 + k * 3_600_000).toISOString()},${price(k)}`);
  return rows;
}
const build = (rows: string[]) => buildSeries(parseCsv(rows.join('\n'), 'f.csv'), { zone: 'Europe/Berlin' });

describe('describeIngest(series, report)', () => {
  it('says how many periods, of what length, in how many days, from when to when', () => {
    const { series, report } = build(hourlyRows('2025-01-05T23:00:00Z', 48));
    expect(describeIngest(series, report)).toEqual(['48 periods of 60 minutes in 2 delivery days, 2025-01-06 to 2025-01-07 (Europe/Berlin)']);
  });

  it('lists complete daylight-saving days with their period count (Directive 2000/84/EC: 23 and 25 hours)', () => {
    const spring = build(hourlyRows('2025-03-28T23:00:00Z', 24 + 23 + 24));
    expect(describeIngest(spring.series, spring.report)[1]).toBe('daylight-saving days: 2025-03-30 (23)');
    const autumn = build(hourlyRows('2025-10-25T22:00:00Z', 25));
    expect(describeIngest(autumn.series, autumn.report)[1]).toBe('daylight-saving days: 2025-10-26 (25)');
  });

  it('does not call a day cut by the data edge a daylight-saving day', () => {
    const cut = build(hourlyRows('2025-03-30T05:00:00Z', 30));
    expect(describeIngest(cut.series, cut.report).some((l) => l.startsWith('daylight-saving'))).toBe(false);
  });

  it('names six daylight-saving days and counts the rest', () => {
    // four years of hourly Berlin periods hold eight change days (2025-2028, last Sundays of March and October)
    const t0 = Date.parse('2024-12-31T23:00:00Z'), n = 4 * 8766;
    const times = Array.from({ length: n }, (_, k) => t0 + k * 3_600_000);
    const series: Series = { times, price: times.map(() => 1), drivers: {}, resolution: 60, zone: 'Europe/Berlin' };
    const report: IngestReport = { rows: n, periods: n, gaps: [], outOfOrderRows: 0, missingPrices: 0, markedUnknown: 0 };
    expect(describeIngest(series, report)[1]).toBe(
      'daylight-saving days: 2025-03-30 (23), 2025-10-26 (25), 2026-03-29 (23), 2026-10-25 (25), 2027-03-28 (23), 2027-10-31 (25) and 2 more');
  });

  it('reports sorted rows, gaps with the local time of the first, and missing prices', () => {
    const rows = hourlyRows('2025-01-05T23:00:00Z', 24, (k) => (k === 3 ? '' : '40'));
    rows.splice(10, 2); // periods 9 and 10 (09:00 and 10:00 local; rows[0] is the header) have no row
    [rows[1], rows[2]] = [rows[2], rows[1]];
    const { series, report } = build(rows);
    expect(describeIngest(series, report).slice(1)).toEqual([
      '1 row was out of time order and has been sorted',
      '1 gap, 2 periods with no row (first at 2025-01-06T09:00:00+01:00); their values count as unknown',
      '3 periods have no price; model inputs take the same period of the nearest earlier day, scores skip them',
    ]);
  });
});
