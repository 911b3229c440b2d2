import { describe, expect, it } from 'vitest';
import { parseA1 } from '../../src/host/a1';
import { CAUTION, MAX_PERIODS, OUTLOOK_FRAME, outlookLayout, type OutlookInput } from '../../src/pane/logic/outlook-layout';

const ZONE = 'Europe/Berlin';
// 2025-10-26 is a 25-hour day in Berlin (Directive 2000/84/EC)
const t0 = Date.parse('2025-10-26T00:00:00+02:00');
const rows = Array.from({ length: 25 }, (_, i) => ({ time: t0 + i * 3_600_000, forecast: 50 + i, lower: 40 + i, upper: 60 + i }));
const input: OutlookInput = {
  model: 'main', coverage: 0.9, issuedAt: Date.parse('2025-10-25T11:30:00+02:00'), zone: ZONE, dateSystem: '1900', rows,
  data: { times: 'History!A2:A500', prices: 'History!B2:B500', drivers: ['History!C2:C500'], driverNames: ['load'], rows: 499 },
  scores: [{ name: 'main', mae: 5.5, rmse: 7.25, smape: 11, rmae: 0.62, coverage: 0.88, span: 'backtest 2025-09-27 to 2025-10-24' }],
};

describe('outlookLayout(input)', () => {
  it('fills one fixed frame, so a shorter day leaves nothing of a longer one behind', () => {
    const layout = outlookLayout(input);
    const frame = parseA1(layout.frame);
    expect(layout.frame).toBe(OUTLOOK_FRAME);
    expect(layout.values.length).toBe(frame.rows);
    expect(layout.values.every((r) => r.length === frame.columns)).toBe(true);
    const shorter = outlookLayout({ ...input, rows: rows.slice(0, 24) });
    expect(shorter.values.length).toBe(frame.rows);
    expect(shorter.values[12 + 24].every((v) => v === '')).toBe(true);
  });

  it('has title, issue time, the caution line and the recent scores', () => {
    const { values } = outlookLayout(input);
    expect(values[0].slice(0, 6)).toEqual(['Spotloom outlook', 'model main', '', 'issued', '2025-10-25T11:30:00+02:00', 'times in Europe/Berlin']);
    expect(values[1][0]).toBe(CAUTION);
    expect(values[3]).toEqual(['recent scores', 'MAE', 'RMSE', 'sMAPE %', 'rMAE', 'coverage', 'scored on']);
    expect(values[4]).toEqual(['main', 5.5, 7.25, 11, 0.62, 0.88, 'backtest 2025-09-27 to 2025-10-24']);
  });

  it('says when there are no scores yet', () => {
    expect(outlookLayout({ ...input, scores: [] }).values[4][0]).toMatch(/none yet/);
  });

  it("lays tomorrow's table with live LOOM formulas in its first period row and the baselines beside them", () => {
    const { values } = outlookLayout(input);
    expect(values[11].slice(0, 6)).toEqual(['delivery start', 'forecast', 'lower', 'upper', 'naive-week', 'weekday-rule']);
    expect(values[12].slice(1, 6)).toEqual([
      '=LOOM.AHEAD("main", History!$A$2:$A$500, History!$B$2:$B$500, History!$A$2:$A$500, History!$C$2:$C$500)',
      '=LOOM.BAND("main", History!$A$2:$A$500, History!$B$2:$B$500, History!$A$2:$A$500, History!$C$2:$C$500, 0.9)',
      '',
      '=LOOM.BASELINE(History!$A$2:$A$500, History!$B$2:$B$500, "week")',
      '=LOOM.BASELINE(History!$A$2:$A$500, History!$B$2:$B$500, "weekday-rule")',
    ]);
    // date-time cells of the market's wall clock: 2025-10-26 is serial 45956 in the 1900 date system;
    // the repeated hour shows 02:00 twice, as the clock on the wall does
    expect(values.slice(12, 15).map((r) => r[0])).toEqual([45956, 45956 + 1 / 24, 45956 + 2 / 24]);
    expect(values[15][0]).toBe(45956 + 2 / 24);
    expect(values[36][0]).toBe(45956 + 23 / 24);
  });

  it('carries number formats: prices two decimals, rMAE three, coverage per cent, delivery starts date-time, the whole table area', () => {
    const { formats, values } = outlookLayout(input);
    expect(formats.length).toBe(values.length);
    expect(formats[4]).toEqual([null, '0.00', '0.00', '0.00', '0.000', '0.0%', null]);
    expect(formats[11].every((f) => f === null)).toBe(true); // the header
    for (const r of [12, 36, 111]) expect(formats[r]).toEqual(['yyyy-mm-dd hh:mm', '0.00', '0.00', '0.00', '0.00', '0.00', null]);
  });

  it('in a workbook of the 1904 date system the serials are 1462 days smaller (ECMA-376 Part 1, 18.17.4.1)', () => {
    expect(outlookLayout({ ...input, dateSystem: '1904' }).values[12][0]).toBe(45956 - 1462);
  });

  it('points the chart at the header row and every period row, first column as categories', () => {
    expect(outlookLayout(input).chart).toEqual({ sheet: 'Outlook', address: 'Outlook!A12:F37', title: 'Tomorrow: forecast, band and baselines' });
  });

  it('refuses no periods, too many periods, and split driver ranges', () => {
    expect(() => outlookLayout({ ...input, rows: [] })).toThrow(/no forecast for tomorrow/);
    const many = Array.from({ length: MAX_PERIODS + 1 }, (_, i) => ({ ...rows[0], time: t0 + i * 900_000 }));
    expect(() => outlookLayout({ ...input, rows: many })).toThrow(/at most 100/);
    expect(() => outlookLayout({ ...input, data: { ...input.data, drivers: ['A1:A2', 'B1:B2'] } })).toThrow(/one range/);
  });
});
