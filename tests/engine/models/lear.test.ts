import { describe, expect, it } from 'vitest';
import {
  addDays, calibrateLear, createModel, frameBefore, inputFrame, InputError, Lear, learForecast, predictLear, runBacktest,
  type DayFrame, type Series,
} from '../../../src/engine';
import { syntheticSeries } from '../../support/synthetic';

// Invented data (tests/support/synthetic.ts) for properties only; LEAR's reference values are
// checked in tests/reference/lear-taylor.test.ts.
const series = syntheticSeries(140);
const frame = inputFrame(series);

function backtest(s: Series, retrainEvery: number) {
  return runBacktest(new Lear(), inputFrame(s), s, { testStart: '2025-05-01', testEnd: '2025-05-14', retrainEvery }).rows;
}

/** A quarter-hourly frame of invented days: a daily shape, a weekly cycle, one driver. */
function quarterHourFrame(days: number): DayFrame {
  const slots = 96;
  const price: Float64Array[] = [], load: Float64Array[] = [];
  let noise = 0;
  for (let d = 0; d <= days; d++) {
    const p = new Float64Array(slots), l = new Float64Array(slots);
    for (let s = 0; s < slots; s++) {
      noise = 0.7 * noise + Math.sin(d * 7.1 + s * 0.37) * 2;
      l[s] = 50 + 20 * Math.sin(((s / 4 - 7) / 24) * 2 * Math.PI) + (d % 7 >= 5 ? -8 : 0) + Math.cos(d * 1.3 + s) * 2;
      p[s] = 10 + 0.9 * l[s] + noise;
    }
    price.push(p); load.push(l);
  }
  return {
    zone: 'UTC', resolution: 15, slots,
    days: Array.from({ length: days + 1 }, (_, i) => ({ date: addDays('2025-01-06', i), start: i * slots, count: slots, expected: slots, slots: [...Array(slots).keys()] })),
    price: price.slice(0, days), drivers: { load },
  };
}

describe('Lear, the LEAR benchmark as a DayAheadModel', () => {
  it('is named lear, needs 28 days and recalibrates daily by default', () => {
    const m = createModel('lear');
    expect(m).toBeInstanceOf(Lear);
    expect([m.name, m.minHistoryDays, m.defaultRetrainEvery]).toEqual(['lear', 28, 1]);
  });

  it.each([1, 0, 3])('with retrain-every %d: prices at or after day D never change a forecast before D', (every) => {
    const cut = series.times.findIndex((t) => t >= Date.parse('2025-05-10T00:00:00+02:00'));
    const changed: Series = { ...series, price: series.price.map((p, i) => (i >= cut ? -p * 2 + 500 : p)) };
    const a = backtest(series, every), b = backtest(changed, every);
    const before = (r: { time: number }) => r.time < series.times[cut];
    const fa = a.filter(before), fb = b.filter(before);
    expect(fa.length).toBeGreaterThan(200);
    expect(fb.map((r) => r.forecast)).toEqual(fa.map((r) => r.forecast));
    // the change reaches the days after it, so the check can fail
    expect(b.filter((r) => !before(r)).map((r) => r.forecast)).not.toEqual(a.filter((r) => !before(r)).map((r) => r.forecast));
  });

  it('gives no band and finite forecasts on every period of a backtest across the spring change (23 hours)', () => {
    const rows = runBacktest(new Lear(), frame, series, { testStart: '2025-03-28', testEnd: '2025-04-01', retrainEvery: 1 }).rows;
    expect(rows.filter((r) => frame.days[r.day].date === '2025-03-30')).toHaveLength(23);
    expect(rows.every((r) => Number.isFinite(r.forecast) && Number.isNaN(r.lower) && Number.isNaN(r.upper))).toBe(true);
  });

  it('forecasts the 25 periods of the autumn change', () => {
    const autumn = syntheticSeries(60, 5, '2025-09-01T22:00:00Z');
    const rows = runBacktest(new Lear(), inputFrame(autumn), autumn, { testStart: '2025-10-26', testEnd: '2025-10-26', retrainEvery: 1 }).rows;
    expect(rows).toHaveLength(25);
    expect(rows.every((r) => Number.isFinite(r.forecast))).toBe(true);
    expect(rows[2].forecast).toBe(rows[3].forecast); // both 02:00 periods share their clock slot
  });

  it('fit + predict equals the pure learForecast, and predict keeps the last calibration until update', () => {
    const d = 100;
    const lear = new Lear();
    lear.fit(frameBefore(frame, d));
    expect(lear.predict(frameBefore(frame, d))).toEqual(learForecast(frameBefore(frame, d)));
    const old = calibrateLear(frameBefore(frame, d));
    expect(lear.predict(frameBefore(frame, d + 1))).toEqual(predictLear(old, frameBefore(frame, d + 1)));
    lear.update(frameBefore(frame, d + 1));
    expect(lear.predict(frameBefore(frame, d + 1))).toEqual(learForecast(frameBefore(frame, d + 1)));
    expect(lear.predict(frameBefore(frame, d + 1))).not.toEqual(predictLear(old, frameBefore(frame, d + 1)));
  });

  it('uses the published inputs when the days support them (two per input)', () => {
    const long = inputFrame(syntheticSeries(400));
    const cal = calibrateLear(frameBefore(long, 399));
    // 96 price + 72 driver + 7 weekday inputs, one driver: 175 ≤ 392 / 2
    expect(cal.design.level).toBe('published');
    expect(cal.design.inputs).toHaveLength(175);
    expect(cal.note).toBeUndefined();
    expect(cal.days).toBe(392);
    expect(cal.periods.every((p) => p.selected > 0 && p.selected < 175)).toBe(true);
  });

  it('takes a reduced per-period set on quarter-hours and says so', () => {
    const qh = quarterHourFrame(200);
    const cal = calibrateLear(qh);
    // 193 days: hourly-profile needs 2 × 182, recent-profile 2 × (24 + 4 + 24 + 3 + 7) = 124
    expect(cal.design.level).toBe('recent-profile');
    expect(cal.note).toBe('lear: 193 calibration days cannot support the published 679 inputs per period; using the "recent-profile" set (62 inputs per period)');
    expect(cal.periods).toHaveLength(96);
    expect(new Set(cal.periods.map((p) => p.inputs.join())).size).toBe(96); // each period has its own slot inputs
    const { point } = predictLear(cal, qh);
    expect(point).toHaveLength(96);
    expect(point.every(Number.isFinite)).toBe(true);
  });

  it('works from 28 days of history with the short set and refuses 27, naming the days needed', () => {
    const cal = calibrateLear(frameBefore(frame, 28));
    expect(cal.design.level).toBe('own-period-short');
    expect(cal.days).toBe(25);
    expect(cal.note).toMatch(/25 calibration days cannot support the published 175 inputs per period; using the "own-period-short" set \(6 inputs per period\)/);
    expect(predictLear(cal, frameBefore(frame, 28)).point.every(Number.isFinite)).toBe(true);
    expect(() => calibrateLear(frameBefore(frame, 27))).toThrow(InputError);
    expect(() => calibrateLear(frameBefore(frame, 27))).toThrow('lear needs at least 28 days of price history before the forecast day; the data has 27');
    expect(() => runBacktest(new Lear(), frame, series, { testStart: '2025-01-30' })).toThrow(/needs at least 28/);
  });

  it('calibrates on the last windowDays days only', () => {
    const cal = calibrateLear(frameBefore(frame, 130), { windowDays: 60, criterion: 'aic', maxSteps: 2500 });
    expect(cal.days).toBe(60 - 7);
    expect(cal.from).toBe(frame.days[130 - 60 + 7].date);
    expect(cal.to).toBe(frame.days[129].date);
  });

  it('refuses, with one line, a forecast day without the driver it was calibrated with, or with too many drivers for the days', () => {
    const cal = calibrateLear(frameBefore(frame, 100));
    const bare = { ...frameBefore(frame, 100), drivers: {} };
    expect(() => predictLear(cal, bare)).toThrow(`lear was calibrated with driver "load_forecast", which the data for ${frame.days[100].date} lacks`);
    const view = frameBefore(frame, 28);
    const many = { ...view, drivers: Object.fromEntries(Array.from({ length: 12 }, (_, i) => [`d${i}`, view.drivers.load_forecast])) };
    expect(() => calibrateLear(many)).toThrow(/lear cannot calibrate: even its smallest input set \(15 inputs need 30 usable days, the window has 26\)/);
  });
});
