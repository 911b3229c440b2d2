import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import {
  baselineModel, buildSeries, inputFrame, parseCsv, runBacktest, targetDay, type DayAheadModel, type Series,
} from '../../../src/engine';

const ZONE = 'Europe/Berlin';

// Hourly series spanning the EU spring change of 2025 (Directive 2000/84/EC).
function series(days: number, price: (k: number) => number): Series {
  const rows = ['timestamp,price'];
  const t0 = Date.parse('2025-03-09T23:00:00Z'); // local 2025-03-10 00:00
  for (let k = 0; k < days * 24 - 1; k++) rows.push(`${new Date(t0 + k * 3_600_000).toISOString()},${price(k)}`);
  return buildSeries(parseCsv(rows.join('\n'), 's.csv'), { zone: ZONE }).series;
}

const wobble = (k: number) => 40 + 20 * Math.sin(k / 3.7) + (k % 11) - 0.37 * (k % 5);

describe('runBacktest(model, frame, series, options)', () => {
  it('naive-week MAE equals a hand computation by local clock time, across the spring change', () => {
    const s = series(40, wobble);
    const { rows, summary } = runBacktest(baselineModel('naive-week'), inputFrame(s), s, { testStart: '2025-04-01' });
    // hand rule: the price at the same local wall time 7 days earlier; the wall
    // time 02:00 skipped on 2025-03-30 is the mean of 01:00 and 03:00 that day.
    const byWall = new Map<string, number>();
    s.times.forEach((t, i) => byWall.set(DateTime.fromMillis(t, { zone: ZONE }).toFormat("yyyy-MM-dd'T'HH:mm"), s.price[i]));
    let sum = 0, n = 0;
    for (const r of rows) {
      const wall = DateTime.fromMillis(r.time, { zone: ZONE });
      const back = wall.minus({ days: 7 }).toFormat('yyyy-MM-dd');
      const key = `${back}T${wall.toFormat('HH:mm')}`;
      const lag = byWall.get(key) ?? (byWall.get(`${back}T01:00`)! + byWall.get(`${back}T03:00`)!) / 2;
      expect(r.forecast).toBe(lag);
      sum += Math.abs(r.actual - lag); n++;
    }
    expect(summary.mae).toBeCloseTo(sum / n, 9);
    expect(summary.periods).toBe(n);
    expect(summary.days).toBe(18); // 2025-04-01 to 2025-04-18
  });

  it('rMAE of naive-day is its MAE over the naive-week MAE of the same periods, by hand', () => {
    const s = series(40, wobble);
    const { rows, summary } = runBacktest(baselineModel('naive-day'), inputFrame(s), s, { testStart: '2025-04-07' });
    // hand rule: the prices at the same local wall time one day and seven days earlier
    // (the spring change of 2025-03-30 lies before 2025-03-31, the first day lagged, so every lag exists)
    const byWall = new Map<string, number>();
    s.times.forEach((t, i) => byWall.set(DateTime.fromMillis(t, { zone: ZONE }).toFormat("yyyy-MM-dd'T'HH:mm"), s.price[i]));
    const lag = (t: number, days: number) => {
      const wall = DateTime.fromMillis(t, { zone: ZONE });
      return byWall.get(`${wall.minus({ days }).toFormat('yyyy-MM-dd')}T${wall.toFormat('HH:mm')}`)!;
    };
    let day = 0, week = 0;
    for (const r of rows) {
      expect(r.forecast).toBe(lag(r.time, 1));
      day += Math.abs(r.actual - lag(r.time, 1));
      week += Math.abs(r.actual - lag(r.time, 7));
    }
    expect(summary.rmae).toBeCloseTo(day / week, 12);
    expect(summary.rmae).not.toBeCloseTo(1, 2);
  });

  it('weekday-rule uses D-1 on Tuesday and D-7 on Monday', () => {
    const s = series(30, (k) => k);
    const { rows } = runBacktest(baselineModel('weekday-rule'), inputFrame(s), s, { testStart: '2025-03-31', testEnd: '2025-04-01' });
    const monday = rows.filter((r) => r.day === rows[0].day);
    const tuesday = rows.filter((r) => r.day !== rows[0].day);
    expect(monday[5].actual - monday[5].forecast).toBe(7 * 24 - 1); // a week back, 23-hour day in between
    expect(tuesday[5].actual - tuesday[5].forecast).toBe(24);
  });

  it('never lets a price at or after day D change a forecast for a day before D', () => {
    const s = series(40, wobble);
    const cut = s.times.findIndex((t) => t >= Date.parse('2025-04-10T00:00:00+02:00'));
    const changed = { ...s, price: s.price.map((p, i) => (i >= cut ? p * 3 + 100 : p)) };
    for (const kind of ['naive-day', 'naive-week', 'weekday-rule'] as const) {
      const a = runBacktest(baselineModel(kind), inputFrame(s), s, { testStart: '2025-04-01' }).rows;
      const b = runBacktest(baselineModel(kind), inputFrame(changed), changed, { testStart: '2025-04-01' }).rows;
      const before = (r: { time: number }) => r.time < s.times[cut];
      expect(b.filter(before).map((r) => r.forecast)).toEqual(a.filter(before).map((r) => r.forecast));
    }
  });

  it('refuses a test start outside the data or without enough history', () => {
    const s = series(20, wobble);
    expect(() => runBacktest(baselineModel('naive-week'), inputFrame(s), s, { testStart: '2031-01-01' })).toThrow(/outside the data/);
    expect(() => runBacktest(baselineModel('naive-week'), inputFrame(s), s, { testStart: '2025-03-12' })).toThrow(/needs at least 7/);
    expect(() => runBacktest(baselineModel('naive-week'), inputFrame(s), s, { testStart: '2025-3-12' })).toThrow(/not a date/);
  });

  it('skips unknown actual prices in the scores but keeps their rows', () => {
    const s = series(20, wobble);
    const idx = s.times.findIndex((t) => t >= Date.parse('2025-03-25T12:00:00+01:00'));
    s.price[idx] = NaN;
    const { rows, summary } = runBacktest(baselineModel('naive-day'), inputFrame(s), s, { testStart: '2025-03-25', testEnd: '2025-03-25' });
    expect(rows).toHaveLength(24);
    const ok = rows.filter((r) => Number.isFinite(r.actual));
    expect(ok).toHaveLength(23);
    expect(summary.mae).toBeCloseTo(ok.reduce((a, r) => a + Math.abs(r.actual - r.forecast), 0) / 23, 12);
  });
});

/** naive-week that records the target day of every view it is fitted or refreshed on. */
function recordingModel(minHistoryDays = 7) {
  const fitted: number[] = [];
  const updated: number[] = [];
  const predicted: number[] = [];
  const base = baselineModel('naive-week');
  const model: DayAheadModel = {
    name: 'recording', minHistoryDays,
    fit: (view) => { fitted.push(targetDay(view)); },
    predict: (view) => { predicted.push(targetDay(view)); return base.predict(view); },
    update: (view) => { updated.push(targetDay(view)); },
  };
  return { model, fitted, updated, predicted };
}

// The walk-forward schedule (Weron 2014, Int. J. Forecasting 30(4), sec. 3: a rolling
// calibration window, re-estimated every k days): fit once on the days before the first
// test day, then refresh on the view of every k-th day after it, never on the first.
// Series from 2025-03-10: 2025-03-17 is day index 7, 2025-03-26 day index 16.
describe('runBacktest: fit, refresh, progress and cancel', () => {
  const span = { testStart: '2025-03-17', testEnd: '2025-03-26' };

  it.each([
    [0, []],
    [1, [8, 9, 10, 11, 12, 13, 14, 15, 16]],
    [3, [10, 13, 16]],
    [undefined, []],
  ])('retrainEvery %s refreshes on the views of days %j', (retrainEvery, days) => {
    const s = series(20, wobble);
    const r = recordingModel();
    runBacktest(r.model, inputFrame(s), s, { ...span, retrainEvery });
    expect(r.fitted).toEqual([7]);
    expect(r.updated).toEqual(days);
    expect(r.predicted).toEqual([7, 8, 9, 10, 11, 12, 13, 14, 15, 16]);
  });

  it('reports progress once per forecast day, out of the days in the span', () => {
    const s = series(20, wobble);
    const calls: [number, number, string][] = [];
    runBacktest(baselineModel('naive-week'), inputFrame(s), s, { ...span, progress: (done, total, what) => calls.push([done, total, what]) });
    expect(calls).toEqual(Array.from({ length: 10 }, (_, k) => [k + 1, 10, 'forecast days']));
  });

  it('stops with an InputError when the signal is set between days', () => {
    const s = series(20, wobble);
    const r = recordingModel();
    const signal = { aborted: false };
    const progress = (done: number) => { if (done === 2) signal.aborted = true; };
    expect(() => runBacktest(r.model, inputFrame(s), s, { ...span, progress, signal })).toThrow('the backtest was cancelled');
    expect(r.predicted).toEqual([7, 8]);
  });

  it('reports its own run time in seconds, not more than the time measured around it', () => {
    const s = series(20, wobble);
    const before = Date.now();
    const { summary } = runBacktest(baselineModel('naive-week'), inputFrame(s), s, span);
    const elapsed = (Date.now() - before) / 1000;
    expect(summary.seconds).toBeGreaterThanOrEqual(0);
    expect(summary.seconds).toBeLessThanOrEqual(elapsed);
  });

  it('gives no band scores for a model without bands', () => {
    const s = series(20, wobble);
    const { summary } = runBacktest(baselineModel('naive-week'), inputFrame(s), s, span);
    expect(summary).not.toHaveProperty('bands');
    expect(summary).not.toHaveProperty('nominalCoverage');
  });
});

// The test span's refusals, word for word (error contract, design.md: where and what to fix).
describe('runBacktest: the test span', () => {
  const s = series(20, wobble); // local days 2025-03-10 .. 2025-03-29
  const frame = inputFrame(s);
  const run = (options: { testStart: string; testEnd?: string }, model = baselineModel('naive-week')) =>
    runBacktest(model, frame, s, options);

  it('needs exactly minHistoryDays days before the first test day', () => {
    expect(run({ testStart: '2025-03-17', testEnd: '2025-03-17' }).rows).toHaveLength(24);
    expect(() => run({ testStart: '2025-03-16' })).toThrow(
      '--test-start 2025-03-16 leaves 6 days of history before it; model naive-week needs at least 7',
    );
  });

  it('reads only whole YYYY-MM-DD dates', () => {
    for (const bad of ['x2025-03-20', '2025-03-20x', '2025-03-20T00:00']) {
      expect(() => run({ testStart: bad })).toThrow(`--test-start "${bad}" is not a date YYYY-MM-DD`);
      expect(() => run({ testStart: '2025-03-20', testEnd: bad })).toThrow(`--test-end "${bad}" is not a date YYYY-MM-DD`);
    }
  });

  it('refuses an end before the start, and a start before or after the data', () => {
    expect(() => run({ testStart: '2025-03-20', testEnd: '2025-03-18' })).toThrow(
      '--test-end 2025-03-18 is before --test-start 2025-03-20',
    );
    for (const start of ['2025-01-01', '2031-01-01']) {
      expect(() => run({ testStart: start })).toThrow(
        `--test-start ${start} is outside the data, which covers 2025-03-10 to 2025-03-29`,
      );
    }
  });

  it('a model that needs no history may start on the first day of the data', () => {
    const r = recordingModel(0);
    expect(run({ testStart: '2025-03-10', testEnd: '2025-03-11' }, r.model).rows).toHaveLength(48);
    expect(r.fitted).toEqual([0]);
  });

  it('ends on the last day that has a known price, and refuses a span with none', () => {
    const gap = series(20, wobble);
    const from = gap.times.findIndex((t) => t >= Date.parse('2025-03-28T00:00:00+01:00'));
    for (let i = from; i < gap.price.length; i++) gap.price[i] = NaN; // 2025-03-28 and 2025-03-29 unknown
    const { rows, summary } = runBacktest(baselineModel('naive-week'), inputFrame(gap), gap, { testStart: '2025-03-25' });
    expect(summary.days).toBe(3); // 25, 26, 27 March
    expect(rows).toHaveLength(3 * 24);
    expect(() => runBacktest(baselineModel('naive-week'), inputFrame(gap), gap, { testStart: '2025-03-28' })).toThrow(
      'the test span from 2025-03-28 holds no day with known prices (the data covers 2025-03-10 to 2025-03-29)',
    );
  });
});
