import fc from 'fast-check';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { BASELINE_KINDS, baselineModel, inputFrame, mae, runBacktest, type BaselineKind, type Series } from '../../src/engine';
import { close, outcome, params, ZONES } from './support';

/**
 * runBacktest with the naive baselines on generated series (random zone,
 * resolution, daylight-saving days, unknown prices, partial first day),
 * against a computation by hand: every forecast is the price at the same
 * local clock slot on D-1 or D-7 (weekday rule: D-7 for Monday, Saturday and
 * Sunday, else D-1; Nowotarski & Weron 2018), with the repeated hour's two
 * prices averaged, a skipped hour interpolated between its neighbouring
 * slots, and an unknown value taken from the same slot of the nearest
 * earlier day (the documented rules of day-matrix.ts and fill-missing.ts).
 * MAE and rMAE are then computed by hand over the forecast rows. Local days
 * and clock times come from luxon (a general-purpose date library).
 */

const plan = fc.record({
  zone: fc.constantFrom(...ZONES),
  resolution: fc.constantFrom(15, 30, 60) as fc.Arbitrary<15 | 30 | 60>,
  startDate: fc.oneof(
    fc.constantFrom('2025-03-22', '2025-10-19', '2024-03-02', '2024-10-26', '2025-03-30', '2015-10-10', '2018-02-10', '2025-09-28'),
    fc.date({ min: new Date('1975-01-01'), max: new Date('2060-01-01'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
  ),
  startSlot: fc.oneof(fc.constant(0), fc.integer({ min: 0, max: 30 })),
  days: fc.oneof({ weight: 1, arbitrary: fc.integer({ min: 2, max: 8 }) }, { weight: 5, arbitrary: fc.integer({ min: 9, max: 24 }) }),
  prices: fc.array(fc.oneof({ weight: 12, arbitrary: fc.double({ min: -100, max: 400, noNaN: true }) }, { weight: 1, arbitrary: fc.constant(NaN) }), { minLength: 800, maxLength: 800 }),
  unknownDay: fc.option(fc.nat(30), { nil: undefined }),
  kind: fc.constantFrom(...BASELINE_KINDS),
  testStart: fc.oneof({ weight: 2, arbitrary: fc.nat(30) }, { weight: 8, arbitrary: fc.integer({ min: 7, max: 20 }) }, { weight: 1, arbitrary: fc.constantFrom('1970-01-01', '2199-01-01', '2025-3-1', 'tomorrow', '') }),
  testEnd: fc.option(fc.oneof(fc.nat(30), fc.constantFrom('1970-01-01', '2199-12-31', 'x')), { nil: undefined, freq: 3 }),
  retrainEvery: fc.constantFrom(0, 1, 7),
});
type Plan = typeof plan extends fc.Arbitrary<infer T> ? T : never;

interface Period { t: number; date: string; slot: number; price: number }

function makeSeries(p: Plan): { series: Series; periods: Period[]; dates: string[] } {
  const step = p.resolution * 60_000;
  const t0 = DateTime.fromISO(p.startDate, { zone: p.zone }).startOf('day').toMillis() + p.startSlot * step;
  const n = Math.min(800, Math.round((p.days * 1440) / p.resolution));
  const periods: Period[] = [];
  for (let i = 0; i < n; i++) {
    const t = t0 + i * step;
    const local = DateTime.fromMillis(t, { zone: p.zone });
    periods.push({ t, date: local.toISODate()!, slot: Math.floor((local.hour * 60 + local.minute) / p.resolution), price: p.prices[i] });
  }
  const dates = [...new Set(periods.map((x) => x.date))];
  if (p.unknownDay !== undefined) {
    const d = dates[p.unknownDay % dates.length];
    for (const x of periods) if (x.date === d) x.price = NaN;
  }
  const series: Series = { times: periods.map((x) => x.t), price: periods.map((x) => x.price), drivers: {}, resolution: p.resolution, zone: p.zone };
  return { series, periods, dates };
}

const shift = (date: string, days: number) => DateTime.fromISO(date, { zone: 'utc' }).plus({ days }).toISODate()!;

/** The by-hand forecasts for every period of the series, per baseline kind. */
function handForecasts(p: Plan, periods: Period[], dates: string[]) {
  const slots = 1440 / p.resolution;
  const byDay = new Map<string, Period[]>();
  for (const x of periods) { if (!byDay.has(x.date)) byDay.set(x.date, []); byDay.get(x.date)!.push(x); }
  const dayLength = (date: string) => { const s = DateTime.fromISO(date, { zone: p.zone }).startOf('day'); return (s.plus({ days: 1 }).toMillis() - s.toMillis()) / 60_000 / p.resolution; };
  // the day's value per clock slot: mean of known prices, skipped slots of a whole day interpolated
  const raw = new Map<string, number[]>();
  for (const [date, ps] of byDay) {
    const row = new Array<number>(slots).fill(NaN);
    const has = new Array<boolean>(slots).fill(false);
    for (let s = 0; s < slots; s++) {
      const here = ps.filter((x) => x.slot === s);
      has[s] = here.length > 0;
      const known = here.filter((x) => !Number.isNaN(x.price));
      if (known.length) row[s] = known.reduce((a, x) => a + x.price, 0) / known.length;
    }
    if (ps.length === dayLength(date)) {
      for (let s = 0; s < slots; s++) {
        if (has[s]) continue;
        let a = s - 1; while (a >= 0 && !has[a]) a--;
        let b = s + 1; while (b < slots && !has[b]) b++;
        if (a < 0) row[s] = row[b];
        else if (b >= slots) row[s] = row[a];
        else row[s] = row[a] + ((row[b] - row[a]) * (s - a)) / (b - a);
      }
    }
    raw.set(date, row);
  }
  // unknown values from the same slot of the nearest earlier day
  const filled = new Map<string, number[]>();
  let last = new Array<number>(slots).fill(NaN);
  for (const date of dates) {
    const row = raw.get(date)!.map((v, s) => (Number.isNaN(v) ? last[s] : v));
    last = row;
    filled.set(date, row);
  }
  const lagOf = (kind: BaselineKind, date: string) => {
    if (kind === 'naive-day') return 1;
    if (kind === 'naive-week') return 7;
    const w = DateTime.fromISO(date).weekday;
    return w === 1 || w >= 6 ? 7 : 1;
  };
  return (kind: BaselineKind, x: Period) => filled.get(shift(x.date, -lagOf(kind, x.date)))?.[x.slot] ?? NaN;
}

describe('runBacktest(baseline, ...) on generated series', () => {
  it('forecasts every period of the test span as computed by hand, with MAE and rMAE over those rows', () => {
    fc.assert(fc.property(plan, (p) => {
      const { series, periods, dates } = makeSeries(p);
      const asDate = (v: number | string) => (typeof v === 'number' ? dates[Math.min(v, dates.length - 1)] : v);
      const testStart = asDate(p.testStart);
      const testEnd = p.testEnd === undefined ? undefined : asDate(p.testEnd);
      const model = baselineModel(p.kind);
      const got = outcome(() => runBacktest(model, inputFrame(series), series, { testStart, testEnd, retrainEvery: p.retrainEvery }));

      // the span rules of run-backtest.ts, by hand
      const iso = /^\d{4}-\d{2}-\d{2}$/;
      const known = (d: string) => periods.some((x) => x.date === d && !Number.isNaN(x.price));
      const lastKnownDay = [...dates].reverse().find(known);
      let refuse = !iso.test(testStart) || (testEnd !== undefined && (!iso.test(testEnd) || testEnd < testStart)) || lastKnownDay === undefined;
      const first = dates.findIndex((d) => d >= testStart);
      if (first < 0 || (first === 0 && dates[0] > testStart)) refuse = true;
      let last = dates.length - 1;
      while (last >= first && (dates[last] > (testEnd ?? dates[dates.length - 1]) || !known(dates[last]))) last--;
      if (last < first || first < model.minHistoryDays) refuse = true;
      if (refuse) { expect(got.ok, `should refuse ${testStart}..${testEnd}`).toBe(false); return; }
      expect(got.ok, got.ok ? '' : got.error.message).toBe(true);
      if (!got.ok) return;

      const hand = handForecasts(p, periods, dates);
      const span = new Set(dates.slice(first, last + 1));
      const expected = periods.filter((x) => span.has(x.date));
      const { rows, summary } = got.value;
      expect(rows.map((r) => r.time)).toEqual(expected.map((x) => x.t));
      const wrong: string[] = [];
      rows.forEach((r, i) => {
        const x = expected[i];
        const f = hand(p.kind, x), w = hand('naive-week', x);
        if (!close(r.forecast, f, 1e-12, 1e-9)) wrong.push(`${new Date(x.t).toISOString()} ${x.date} slot ${x.slot}: forecast ${r.forecast}, by hand ${f}`);
        if (!close(r.naiveWeek, w, 1e-12, 1e-9)) wrong.push(`naive-week at ${x.date} slot ${x.slot}: ${r.naiveWeek}, by hand ${w}`);
        if (!Object.is(r.actual, x.price)) wrong.push(`actual ${r.actual} vs ${x.price}`);
        if (!Number.isNaN(r.lower) || !Number.isNaN(r.upper)) wrong.push('a baseline has no band');
      });
      expect(wrong.slice(0, 3)).toEqual([]);

      const scored = rows.filter((r) => Number.isFinite(r.forecast) && Number.isFinite(r.actual));
      const byHand = scored.length ? scored.reduce((s, r) => s + Math.abs(r.forecast - r.actual), 0) / scored.length : NaN;
      expect(close(summary.mae, byHand, 1e-12, 1e-9), `MAE ${summary.mae} vs ${byHand}`).toBe(true);
      const both = scored.filter((r) => Number.isFinite(r.naiveWeek));
      const naiveMae = both.reduce((s, r) => s + Math.abs(r.naiveWeek - r.actual), 0) / both.length;
      const rmaeByHand = both.length ? both.reduce((s, r) => s + Math.abs(r.forecast - r.actual), 0) / both.length / naiveMae : NaN;
      if (Number.isFinite(rmaeByHand)) expect(close(summary.rmae, rmaeByHand, 1e-9, 1e-12), `rMAE ${summary.rmae} vs ${rmaeByHand}`).toBe(true);
      // never a NaN or infinite score when there is something to score
      if (scored.length) for (const v of [summary.mae, summary.rmse, summary.smape]) expect(Number.isFinite(v)).toBe(true);
      if (p.kind === 'naive-week' && both.length && naiveMae > 0) expect(summary.rmae).toBe(1);
      expect(summary.periods).toBe(rows.length);
      expect(summary.days).toBe(span.size);
    }), params(200, 51));
  });

  it('stops with an InputError when cancelled', () => {
    const p = fc.sample(plan, { seed: 5, numRuns: 1 })[0];
    const { series } = makeSeries({ ...p, days: 10, resolution: 60 });
    const signal = { aborted: true };
    const frame = inputFrame(series);
    expect(() => runBacktest(baselineModel('naive-day'), frame, series, { testStart: frame.days[3].date, signal })).toThrow(/cancelled/);
    expect(mae([1], [2])).toBe(1);
  });
});
