import { describe, expect, it } from 'vitest';
import { summarise, type BacktestRow } from '../../../src/engine';
import small from '../../reference/fixtures/metrics-small.json';
import smapeRef from '../../reference/fixtures/metrics-smape.json';

/** the 8 periods of metrics-small.json as backtest rows, two days of four, naive-week off by exactly 2 */
const rows = (): BacktestRow[] => small.actual.map((actual, i) => ({
  time: i * 3_600_000, actual, forecast: small.forecast[i], naiveWeek: actual + (i % 2 ? 2 : -2),
  lower: small.forecast[i] - 5, upper: small.forecast[i] + 5, day: Math.floor(i / 4),
}));

describe('summarise(model, rows, seconds)', () => {
  it('scores MAE and RMSE like R forecast::accuracy() and sMAPE like the exact rational computation', () => {
    // reference: metrics-small.json (R 4.2.2, forecast 8.20 accuracy(): MAE 4.9375, RMSE 5.65320705440726);
    // metrics-smape.json small (Python fractions.Fraction: 35.499631811019455)
    const s = summarise('m', rows(), 1.5);
    expect(s.model).toBe('m');
    expect(s.mae).toBeCloseTo(small.expected.MAE, 12);
    expect(s.rmse).toBeCloseTo(small.expected.RMSE, 12);
    expect(s.smape).toBeCloseTo(smapeRef.small.smape, 10);
    expect(s.seconds).toBe(1.5);
    expect(s.periods).toBe(8);
    expect(s.days).toBe(2);
  });

  it('scores each band level: coverage and the pinball loss of its edges as quantile forecasts', () => {
    // forecast ± 5 as the 80 % band: |actual - forecast| is 1.5 9.5 6.9 1.6 4.5 5.5 2.5 7.5, so 4 of 8 inside;
    // pinball at tau 0.1 (lower) and 0.9 (upper), averaged: 87/80 (exact rational arithmetic, Python fractions)
    const banded = rows().map((r) => ({ ...r, levels: [{ lower: r.lower, upper: r.upper }] }));
    const s = summarise('m', banded, 0, 0.8, [0.8]);
    expect(s.nominalCoverage).toBe(0.8);
    expect(s.coverage).toBe(0.5);
    expect(s.bands).toEqual([{ nominal: 0.8, coverage: 0.5, pinball: expect.closeTo(87 / 80, 12), periods: 8 }]);
    expect(summarise('m', rows(), 0).bands).toBeUndefined();
  });

  it('gives rMAE as the MAE over the naive-week MAE on the same periods', () => {
    // naive-week is off by exactly 2 everywhere: its MAE is 2 (worked by hand)
    expect(summarise('m', rows(), 0).rmae).toBeCloseTo(small.expected.MAE / 2, 12);
  });

  it('gives the share of actual prices inside the bands, ends included', () => {
    // |actual - forecast| per period: 1.5, 9.5, 6.9, 1.6, 4.5, 5.5, 2.5, 7.5: four of eight within ±5 (worked by hand)
    expect(summarise('m', rows(), 0).coverage).toBe(4 / 8);
    const edge = rows().map((r) => ({ ...r, lower: r.actual, upper: r.actual }));
    expect(summarise('m', edge, 0).coverage).toBe(1);
  });

  it('leaves out coverage when the model gives no bands', () => {
    const s = summarise('m', rows().map((r) => ({ ...r, lower: NaN, upper: NaN })), 0);
    expect(s).not.toHaveProperty('coverage');
  });

  it('scores only the periods with both a forecast and an actual price, but counts every period and day', () => {
    const r = [...rows(), { time: 9, actual: NaN, forecast: 10, naiveWeek: 1, lower: 0, upper: 20, day: 2 }, { time: 10, actual: 10, forecast: NaN, naiveWeek: 1, lower: NaN, upper: NaN, day: 3 }];
    const s = summarise('m', r, 0);
    expect(s.mae).toBeCloseTo(small.expected.MAE, 12);
    expect(s.coverage).toBe(4 / 8);
    expect(s.periods).toBe(10);
    expect(s.days).toBe(4);
  });

  it('computes rMAE only on periods with a naive-week forecast', () => {
    const r = rows();
    r[1].naiveWeek = NaN; // drop the period with error 9.5: (4.9375 * 8 - 9.5) / 7 over 2
    expect(summarise('m', r, 0).rmae).toBeCloseTo((small.expected.MAE * 8 - 9.5) / 7 / 2, 12);
    expect(summarise('m', rows().map((x) => ({ ...x, naiveWeek: NaN })), 0).rmae).toBeNaN();
  });

  it('gives NaN scores when nothing can be scored', () => {
    const s = summarise('m', rows().map((r) => ({ ...r, forecast: NaN })), 0);
    expect([s.mae, s.rmse, s.smape, s.rmae]).toEqual([NaN, NaN, NaN, NaN]);
    expect(summarise('m', [], 0)).toMatchObject({ periods: 0, days: 0 });
  });
});

describe('summarise with partial bands', () => {
  // |actual - forecast| per period: 1.5, 9.5, 6.9, 1.6, 4.5, 5.5, 2.5, 7.5 (metrics-small.json),
  // so forecast ± 5 holds periods 1, 4, 5 and 7 (1-based). Worked by hand.
  it('scores coverage only on periods with both edges known', () => {
    const r = rows().map((x, i) => (i < 2 ? { ...x, upper: NaN } : x));
    // periods 3..8 remain: 1.6, 4.5 and 2.5 are inside, 3 of 6
    expect(summarise('m', r, 0).coverage).toBe(3 / 6);
  });

  it('scores each band level only on periods with both of its edges, and leaves out a level no period has', () => {
    const r = rows().map((x, i) => ({ ...x, levels: [{ lower: x.lower, upper: i < 2 ? NaN : x.upper }] }));
    const s = summarise('m', r, 0, 0.8, [0.8, 0.5]);
    expect(s.bands).toHaveLength(1);
    expect(s.bands![0]).toMatchObject({ nominal: 0.8, coverage: 3 / 6, periods: 6 });
    // rows without any levels: every level is left out
    expect(summarise('m', rows(), 0, 0.8, [0.8]).bands).toEqual([]);
  });

  it('has no nominal coverage when none is given', () => {
    expect(summarise('m', rows(), 0)).not.toHaveProperty('nominalCoverage');
  });
});
