import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  bias, mae, mape, mapeGuarded, mase, maseScale, METRIC_NAMES, metricByName, pinball, rmae, rmse, scoreAll, smape,
} from '../../src/engine';
import { close, outcome, params, type Outcome } from './support';

/**
 * Every metric on arrays with NaN (unknown), ±Infinity, huge and tiny
 * values and lengths that differ. The rule: an InputError, or a finite
 * number equal to the textbook formula (Hyndman & Koehler 2006 for MAE,
 * RMSE, sMAPE, MAPE, MASE and bias; Koenker & Bassett 1978 for the pinball
 * loss; rMAE as in Lago et al. 2021), evaluated here on inputs rescaled by
 * a power of two so that nothing overflows. On moderate inputs (|x| <= 1e6)
 * a metric may refuse only for the reasons its doc comment names.
 */

const value = fc.oneof(
  { weight: 10, arbitrary: fc.double({ min: -1e4, max: 1e4, noNaN: true }) },
  { weight: 3, arbitrary: fc.constant(NaN) },
  { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 1, arbitrary: fc.constantFrom(0, -0, 1e308, -1e308, 1.7e308, 5e-324, -1e-310, 1e200, 3) },
  { weight: 1, arbitrary: fc.constantFrom(Infinity, -Infinity) },
);
const moderate = fc.oneof({ weight: 6, arbitrary: fc.double({ min: -1e6, max: 1e6, noNaN: true }) }, { weight: 1, arbitrary: fc.constant(NaN) });

/** Columns of one length, now and then one of another length. */
const columns = (k: number, v = value) => fc.tuple(fc.integer({ min: 0, max: 30 }), fc.boolean(), fc.nat(k - 1), fc.integer({ min: 0, max: 30 }))
  .chain(([n, skew, which, other]) => fc.tuple(...Array.from({ length: k }, (_, c) => fc.array(v, { minLength: skew && c === which ? other : n, maxLength: skew && c === which ? other : n }))));

const isInf = (x: number) => !Number.isNaN(x) && !Number.isFinite(x);
const maxAbs = (cols: readonly (readonly number[])[]) => Math.max(0, ...cols.flat().filter(Number.isFinite).map(Math.abs));
/** 2^e with max / 2^e in [1, 2): dividing by it is exact, and it is finite for every finite max. */
const scaleOf = (m: number) => {
  if (m === 0) return 1;
  let e = Math.min(1023, Math.floor(Math.log2(m)));
  if (2 ** e > m) e--; // log2 may round up just below a power of two
  return 2 ** e;
};

type Reference = { refuse: true } | { refuse: false; value: number; tolerance: number };

/**
 * Shared preconditions of the NaN-skipping metrics; `compute` gets the
 * complete rows rescaled by one power of two, the scale, and the rows as given.
 * `homogeneous`: the metric scales with the values (MAE, bias), so its
 * rounding tolerance does too; otherwise it is unit-free.
 */
function reference(cols: number[][], compute: (rows: number[][], scale: number, raw: number[][]) => number | undefined, homogeneous = true): Reference {
  if (cols.some((c) => c.length !== cols[0].length)) return { refuse: true };
  if (cols.flat().some(isInf)) return { refuse: true };
  const complete: number[][] = [];
  for (let i = 0; i < cols[0].length; i++) if (cols.every((c) => !Number.isNaN(c[i]))) complete.push(cols.map((c) => c[i]));
  const scale = scaleOf(maxAbs(complete));
  const rows = complete.map((r) => r.map((x) => x / scale));
  if (rows.length === 0) return { refuse: true };
  const v = compute(rows, scale, complete);
  // sums of terms of both signs (bias) round at the size of the terms, not of the result;
  // below 1e-150 a score is zero for any price (and squares there underflow)
  const tolerance = homogeneous ? 1e-12 * maxAbs(complete) + 1e-150 : 1e-9;
  return v === undefined ? { refuse: true } : { refuse: false, value: v, tolerance };
}

const meanOf = (xs: number[]) => xs.reduce((s, x) => s + x / xs.length, 0);

/** The fuzz rule for one metric call against its reference. */
function check(got: Outcome<number>, ref: Reference, moderateInput: boolean, what: string) {
  if (ref.refuse) { expect(got.ok, `${what} should refuse`).toBe(false); return; }
  if (!got.ok) {
    // refusing is fine only where the true value is out of range or the input is extreme
    expect(!moderateInput || !Number.isFinite(ref.value), `${what} refused ${got.ok ? '' : got.error.message}; reference ${ref.value}`).toBe(true);
    return;
  }
  expect(Number.isFinite(got.value), `${what} gave ${got.value}`).toBe(true);
  expect(close(got.value, ref.value, 1e-9, ref.tolerance), `${what} gave ${got.value}, reference ${ref.value}`).toBe(true);
}

const isModerate = (cols: number[][]) => cols.flat().every((x) => Number.isNaN(x) || Math.abs(x) <= 1e6);

describe('error metrics on hostile arrays', () => {
  const cases: [string, (a: number[], f: number[]) => number, (rows: number[][], s: number, raw: number[][]) => number | undefined][] = [
    ['mae', mae, (r, s) => meanOf(r.map(([a, f]) => Math.abs(f - a))) * s],
    ['rmse', rmse, (r, s) => Math.sqrt(meanOf(r.map(([a, f]) => (f - a) ** 2))) * s],
    ['bias', bias, (r, s) => meanOf(r.map(([a, f]) => f - a)) * s],
    // per pair: 2|F - A| / (|A| + |F|), rescaled by the pair's own size so tiny pairs count fully
    ['smape', smape, (_r, _s, raw) => 100 * meanOf(raw.map(([a, f]) => {
      const k = scaleOf(Math.max(Math.abs(a), Math.abs(f)));
      const [x, y] = [a / k, f / k];
      return x === 0 && y === 0 ? 0 : (2 * Math.abs(y - x)) / (Math.abs(x) + Math.abs(y));
    }))],
  ];
  it.each(cases)('%s(actual, forecast) is the formula or an InputError', (name, metric, formula) => {
    fc.assert(fc.property(fc.oneof(columns(2), columns(2, moderate)), ([a, f]) => {
      check(outcome(() => metric(a, f)), reference([a, f], formula, name !== 'smape'), isModerate([a, f]), `${name}(${JSON.stringify(a)}, ${JSON.stringify(f)})`);
    }), params(1000, 31));
  });

  it('pinball(actual, forecast, tau) is the formula or an InputError, for any tau', () => {
    const tau = fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(0, 1, NaN, -0.5, 2, Infinity, 0.5));
    fc.assert(fc.property(fc.oneof(columns(2), columns(2, moderate)), tau, ([a, q], t) => {
      const ref = t > 0 && t < 1
        ? reference([a, q], (r, s) => meanOf(r.map(([x, y]) => (x - y >= 0 ? t * (x - y) : (t - 1) * (x - y)))) * s)
        : { refuse: true as const };
      check(outcome(() => pinball(a, q, t)), ref, isModerate([a, q]), `pinball tau ${t}`);
    }), params(800, 32));
  });

  it('mape(actual, forecast, { minAbsActual }) and mapeGuarded are the guarded formula or an InputError', () => {
    const guard = fc.oneof(fc.constant(undefined), fc.double({ min: 1e-12, max: 1e4, noNaN: true }), fc.constantFrom(0, -1, NaN, Infinity, 1e-300));
    fc.assert(fc.property(fc.oneof(columns(2), columns(2, moderate)), guard, ([a, f], g) => {
      const minAbs = g ?? 1;
      let used = 0, total = 0;
      const ref = !(minAbs > 0 && Number.isFinite(minAbs)) ? { refuse: true as const } : reference([a, f], (_rows, _s, raw) => {
        total = raw.length;
        const kept = raw.filter(([x]) => Math.abs(x) >= minAbs);
        used = kept.length;
        if (kept.length === 0) return undefined;
        // per pair |F - A| / |A|, each rescaled by its own size
        return 100 * meanOf(kept.map(([x, y]) => { const k = scaleOf(Math.max(Math.abs(x), Math.abs(y))); return Math.abs(y / k - x / k) / Math.abs(x / k); }));
      }, false);
      const got = outcome(() => mapeGuarded(a, f, { minAbsActual: g }));
      check(outcome(() => mape(a, f, { minAbsActual: g })), ref, isModerate([a, f]) && minAbs >= 1e-6, `mape guard ${g}`);
      if (got.ok && !ref.refuse) expect([got.value.used, got.value.skipped]).toEqual([used, total - used]);
    }), params(800, 33));
  });

  it('rmae(actual, forecast, reference) is the ratio of the two MAEs or an InputError', () => {
    fc.assert(fc.property(fc.oneof(columns(3), columns(3, moderate)), ([a, f, r]) => {
      const ref = reference([a, f, r], (rows) => {
        const num = rows.reduce((s, [x, y]) => s + Math.abs(y - x), 0);
        const den = rows.reduce((s, [x, , z]) => s + Math.abs(z - x), 0);
        return den === 0 ? undefined : num / den;
      }, false);
      check(outcome(() => rmae(a, f, r)), ref, isModerate([a, f, r]), 'rmae');
    }), params(800, 34));
  });

  it('mase(actual, forecast, insample, season) and maseScale are MAE over the seasonal naive MAE, or an InputError', () => {
    const season = fc.oneof(fc.integer({ min: 1, max: 8 }), fc.constantFrom(0, -1, 1.5, NaN, Infinity, 1000));
    fc.assert(fc.property(fc.oneof(columns(2), columns(2, moderate)), fc.oneof(fc.array(value, { maxLength: 30 }), fc.array(moderate, { maxLength: 30 })), season, ([a, f], ins, m) => {
      const scaleRef: Reference = (() => {
        if (!(Number.isInteger(m) && m >= 1) || ins.some(isInf)) return { refuse: true };
        // differences as given; halved where they overflow (the mean of the halves, doubled, is the same)
        const d: number[] = [];
        for (let t = m; t < ins.length; t++) if (!Number.isNaN(ins[t]) && !Number.isNaN(ins[t - m])) d.push(Math.abs(ins[t] - ins[t - m]));
        if (d.length === 0 || d.every((x) => x === 0)) return { refuse: true };
        const half: number[] = [];
        for (let t = m; t < ins.length; t++) if (!Number.isNaN(ins[t]) && !Number.isNaN(ins[t - m])) half.push(Math.abs(ins[t] / 2 - ins[t - m] / 2));
        return { refuse: false, value: d.some((x) => x === Infinity) ? meanOf(half) * 2 : meanOf(d), tolerance: 1e-12 * maxAbs([ins]) + 1e-150 };
      })();
      check(outcome(() => maseScale(ins, m)), scaleRef, isModerate([ins]), 'maseScale');
      const maeRef = reference([a, f], (r, s) => meanOf(r.map(([x, y]) => Math.abs(y - x))) * s);
      const ref: Reference = scaleRef.refuse || maeRef.refuse ? { refuse: true } : { refuse: false, value: maeRef.value / scaleRef.value, tolerance: 1e-9 };
      check(outcome(() => mase(a, f, ins, m)), ref, isModerate([a, f, ins]), 'mase');
    }), params(800, 35));
  });
});

describe('scoreAll and metricByName', () => {
  it('scoreAll gives each metric as alone, NaN only with a note saying why', () => {
    fc.assert(fc.property(fc.oneof(columns(3), columns(3, moderate)), fc.integer({ min: 1, max: 5 }), fc.boolean(), ([a, f, r], season, withRef) => {
      const got = outcome(() => scoreAll(a, f, { season, reference: withRef ? r : undefined }));
      const alone = outcome(() => mae(a, f));
      if (!alone.ok) { expect(got.ok).toBe(false); return; }
      if (!got.ok) {
        // only a bad reference column (length, ±Infinity) or a metric that cannot be computed may stop it
        expect(withRef || !isModerate([a, f])).toBe(true);
        return;
      }
      const s = got.value;
      const same = (x: number, y: Outcome<number>) => (y.ok ? expect(close(x, y.value)).toBe(true) : expect(x).toBeNaN());
      same(s.mae, alone);
      same(s.rmse, outcome(() => rmse(a, f)));
      same(s.smape, outcome(() => smape(a, f)));
      same(s.bias, outcome(() => bias(a, f)));
      same(s.mape, outcome(() => mape(a, f)));
      same(s.mase, outcome(() => mase(a, f, a, season)));
      if (withRef) same(s.rmae!, outcome(() => rmae(a, f, r)));
      const nans = [s.mae, s.rmse, s.smape, s.bias, s.mape, s.mase, ...(withRef ? [s.rmae!] : [])].filter(Number.isNaN).length;
      expect(s.notes.length).toBeGreaterThanOrEqual(nans);
      for (const x of [s.mae, s.rmse, s.smape, s.bias, s.mape, s.mase, s.rmae ?? 0]) expect(Number.isNaN(x) || Number.isFinite(x)).toBe(true);
    }), params(600, 36));
  });

  it('metricByName(name, ...) accepts the names in any case and refuses anything else', () => {
    const name = fc.oneof(
      fc.constantFrom(...METRIC_NAMES).chain((n) => fc.constantFrom(n, n.toLowerCase(), ` ${n} `, n[0] + n.slice(1).toLowerCase())),
      fc.string({ maxLength: 10 }),
      fc.constantFrom('', 'R2', 'mae2', 'toString', '__proto__', 'constructor'),
    );
    const options = fc.record({
      season: fc.option(fc.integer({ min: 1, max: 4 }), { nil: undefined }),
      tau: fc.option(fc.double({ min: 0.01, max: 0.99, noNaN: true }), { nil: undefined }),
      reference: fc.option(fc.array(moderate, { minLength: 6, maxLength: 6 }), { nil: undefined }),
    });
    fc.assert(fc.property(name, fc.array(moderate, { minLength: 6, maxLength: 6 }), fc.array(moderate, { minLength: 6, maxLength: 6 }), options, (n, a, f, o) => {
      const got = outcome(() => metricByName(n, a, f, o));
      const key = n.trim().toUpperCase();
      if (!(METRIC_NAMES as readonly string[]).includes(key)) { expect(got.ok, n).toBe(false); return; }
      const direct: Record<string, () => number> = {
        MAE: () => mae(a, f), RMSE: () => rmse(a, f), SMAPE: () => smape(a, f), MAPE: () => mape(a, f), BIAS: () => bias(a, f),
        MASE: () => { if (o.season === undefined) throw new Error('none'); return mase(a, f, a, o.season); },
        RMAE: () => { if (!o.reference) throw new Error('none'); return rmae(a, f, o.reference); },
        PINBALL: () => { if (o.tau === undefined) throw new Error('none'); return pinball(a, f, o.tau); },
      };
      let want: number | undefined;
      try { want = direct[key](); } catch { want = undefined; }
      if (want === undefined) expect(got.ok).toBe(false);
      else expect(got).toEqual({ ok: true, value: want });
    }), params(800, 37));
  });
});
