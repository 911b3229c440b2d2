import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareForecasts, dailyLossDifferential, dieboldMariano, studentTCdf } from '../../src/engine';
import { close, outcome, params } from './support';

/**
 * The Diebold–Mariano test (HLN correction) and the daily loss differential
 * on hostile input. Reference: the formulas of Diebold & Mariano (1995) and
 * Harvey, Leybourne & Newbold (1997), written out here on the differences
 * divided by a power of two (the statistic does not change with the scale
 * of d, and dividing by 2^k is exact), with the t distribution from
 * studentTCdf (checked against R in tests/reference).
 */

const diff = fc.oneof(
  { weight: 10, arbitrary: fc.double({ min: -100, max: 100, noNaN: true }) },
  { weight: 2, arbitrary: fc.constant(NaN) },
  { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 1, arbitrary: fc.constantFrom(0, 1, -1, 1e300, -1e300, 1e-320, 5e-324, 1.7e308) },
  { weight: 1, arbitrary: fc.constantFrom(Infinity, -Infinity) },
);
const moderateDiff = fc.double({ min: -1e6, max: 1e6, noNaN: true });

const scaleOf = (m: number) => {
  if (m === 0) return 1;
  let e = Math.min(1023, Math.floor(Math.log2(m)));
  if (2 ** e > m) e--;
  return 2 ** e;
};

type Ref = { refuse: true } | { refuse: false; statistic: number; pValue: number; n: number };

function dmReference(raw: number[], h: number): Ref {
  const kept = raw.filter((v) => !Number.isNaN(v));
  if (kept.some((v) => !Number.isFinite(v))) return { refuse: true };
  const n = kept.length;
  if (n < 2 || !(Number.isInteger(h) && h >= 1 && h <= n - 1)) return { refuse: true };
  if (kept.every((v) => v === kept[0])) return kept[0] === 0 ? { refuse: false, statistic: 0, pValue: 0.5, n } : { refuse: true };
  const s = scaleOf(Math.max(...kept.map(Math.abs)));
  const d = kept.map((v) => v / s);
  const mean = d.reduce((a, b) => a + b, 0) / n;
  const gamma = (k: number) => { let sum = 0; for (let t = k; t < n; t++) sum += (d[t] - mean) * (d[t - k] - mean); return sum / n; };
  let v = gamma(0);
  for (let k = 1; k < h; k++) v += 2 * gamma(k);
  if (!(v > 0)) return { refuse: true };
  const statistic = (mean / Math.sqrt(v / n)) * Math.sqrt((n + 1 - 2 * h + (h * (h - 1)) / n) / n);
  return { refuse: false, statistic, pValue: studentTCdf(statistic, n - 1), n };
}

describe('dieboldMariano(lossDiff, { h })', () => {
  it('is the HLN-corrected statistic with its t(n - 1) p-value, or an InputError', () => {
    const h = fc.oneof(fc.integer({ min: 1, max: 4 }), fc.constantFrom(0, -1, 1.5, NaN, 100));
    fc.assert(fc.property(fc.oneof(fc.array(diff, { maxLength: 40 }), fc.array(moderateDiff, { maxLength: 40 })), h, (d, lag) => {
      const got = outcome(() => dieboldMariano(d, { h: lag }));
      const ref = dmReference(d, lag);
      if (ref.refuse) {
        expect(got.ok, `dieboldMariano(${JSON.stringify(d)}, h ${lag}) should refuse`).toBe(false);
        return;
      }
      expect(got.ok, got.ok ? '' : `${got.error.message} for ${JSON.stringify(d)}`).toBe(true);
      if (!got.ok) return;
      expect(got.value.n).toBe(ref.n);
      expect(Number.isFinite(got.value.statistic)).toBe(true);
      expect(got.value.pValue).toBeGreaterThanOrEqual(0);
      expect(got.value.pValue).toBeLessThanOrEqual(1);
      expect(close(got.value.statistic, ref.statistic, 1e-9, 1e-9), `statistic ${got.value.statistic} vs ${ref.statistic} for ${JSON.stringify(d)}`).toBe(true);
      expect(Math.abs(got.value.pValue - ref.pValue)).toBeLessThan(1e-9);
    }), params(1500, 41));
  });

  it('does not change when every difference is multiplied by a power of two (it is scale-free)', () => {
    fc.assert(fc.property(fc.array(moderateDiff, { minLength: 3, maxLength: 30 }), fc.integer({ min: -900, max: 900 }), (d, e) => {
      const base = outcome(() => dieboldMariano(d));
      const scaled = outcome(() => dieboldMariano(d.map((v) => v * 2 ** e)));
      if (!base.ok) return;
      if (d.some((v) => v !== 0 && !Number.isFinite(v * 2 ** e))) return; // overflow of the input itself
      if (d.some((v) => v !== 0 && Math.abs(v * 2 ** e) < 2 ** -1022)) return; // subnormal: the input lost digits
      expect(scaled.ok, scaled.ok ? '' : scaled.error.message).toBe(true);
      if (scaled.ok) expect(scaled.value.statistic).toBeCloseTo(base.value.statistic, 9);
    }), params(800, 42));
  });
});

describe('dailyLossDifferential and compareForecasts', () => {
  const value = fc.oneof(
    { weight: 10, arbitrary: fc.double({ min: -500, max: 3000, noNaN: true }) },
    { weight: 2, arbitrary: fc.constant(NaN) },
    { weight: 1, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
    { weight: 1, arbitrary: fc.constantFrom(1e200, -1e200, 1.7e308, Infinity, -Infinity) },
  );
  const input = fc.integer({ min: 0, max: 40 }).chain((n) => fc.tuple(
    fc.array(value, { minLength: n, maxLength: n }),
    fc.array(value, { minLength: n, maxLength: n }),
    fc.array(value, { minLength: n, maxLength: n }),
    fc.oneof(
      fc.array(fc.integer({ min: 0, max: 6 }), { minLength: n, maxLength: n }),
      fc.constant(Array.from({ length: n }, (_, i) => Math.floor(i / 4))),
      fc.array(fc.oneof(fc.integer({ min: -3, max: 6 }), fc.constantFrom(0.5, NaN)), { minLength: n, maxLength: n }),
      fc.array(fc.integer({ min: 0, max: 6 }), { maxLength: 40 }),
    ),
    fc.constantFrom('abs', 'squared', 'abs', 'log' as never),
  ));

  it('give the per-day mean loss differences and their DM test, or an InputError', () => {
    fc.assert(fc.property(input, ([y, a, b, day, loss]) => {
      const got = outcome(() => dailyLossDifferential(y, a, b, day, loss));
      const cmp = outcome(() => compareForecasts(y, a, b, day, loss));
      const bad = loss !== 'abs' && loss !== 'squared' || day.length !== y.length || day.some((k) => !Number.isInteger(k)) ||
        [...y, ...a, ...b].some((v) => !Number.isNaN(v) && !Number.isFinite(v));
      if (bad) { expect(got.ok).toBe(false); expect(cmp.ok).toBe(false); return; }
      // reference: straightforward grouping by day
      const lossOf = (e: number) => (loss === 'abs' ? Math.abs(e) : e * e);
      const sums = new Map<number, number[]>();
      y.forEach((v, i) => {
        if ([v, a[i], b[i]].some(Number.isNaN)) return;
        if (!sums.has(day[i])) sums.set(day[i], []);
        sums.get(day[i])!.push(lossOf(a[i] - v) - lossOf(b[i] - v));
      });
      const days = [...sums.keys()].sort((p, q) => p - q);
      const ref = days.map((k) => sums.get(k)!.reduce((s, x) => s + x, 0) / sums.get(k)!.length);
      if (days.length === 0) { expect(got.ok).toBe(false); expect(cmp.ok).toBe(false); return; }
      if (!got.ok) {
        // refusing is right only when the losses overflow
        expect(ref.some((x) => !Number.isFinite(x)), got.error.message).toBe(true);
        expect(cmp.ok).toBe(false);
        return;
      }
      expect(got.value.days).toEqual(days);
      got.value.diff.forEach((x, i) => {
        expect(Number.isFinite(x), `day ${days[i]} difference ${x}`).toBe(true);
        expect(close(x, ref[i], 1e-9, 1e-9 * Math.max(1, ...sums.get(days[i])!.map(Math.abs)))).toBe(true);
      });
      const dm = outcome(() => dieboldMariano(got.value.diff, { h: 1 }));
      if (got.value.diff.length < 2 || !dm.ok) { expect(cmp.ok).toBe(false); return; }
      expect(cmp).toEqual({ ok: true, value: { statistic: dm.value.statistic, pValue: dm.value.pValue, days: dm.value.n } });
    }), params(1500, 43));
  });
});
