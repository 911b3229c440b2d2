import { describe, expect, test } from 'vitest';
import { compareForecasts } from '../../src/engine/compare/compare-forecasts';
import { dieboldMariano } from '../../src/engine/compare/diebold-mariano';
import { studentTCdf } from '../../src/engine/compare/student-t-cdf';
import ref from './fixtures/dm-taylor.json';

// Expected values: R 4.2.2 with forecast 8.20, forecast::dm.test() (which applies
// the Harvey-Leybourne-Newbold correction and Student's t with n - 1 df); the
// exact call of each case is in the fixture ("call") and in fixtures/README-metrics.md.
// dm.test(e1, e2, alternative = "less") tests H1 "forecast 1 is more accurate",
// the same one-sided p-value as ours with A = forecast 1.

function expectRelClose(value: number, expected: number, rel = 1e-9): void {
  expect(Math.abs(value - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

describe('dieboldMariano against R forecast::dm.test()', () => {
  test.each(ref.cases.map((c) => [c.call, c] as const))('%s', (_call, c) => {
    const lossDiff = c.lossA.map((v, i) => v - c.lossB[i]);
    const r = dieboldMariano(lossDiff, { h: c.h });
    expectRelClose(r.statistic, c.statistic);
    expect(Math.abs(r.pValue - c.pValue)).toBeLessThan(1e-6);
    expect(r.n).toBe(c.lossA.length);
  });

  test(`two-sided p-value is 2 min(p, 1 - p): ${ref.twoSided.call}`, () => {
    const c = ref.cases[2]; // the same day-10 absolute-loss data
    const r = dieboldMariano(c.lossA.map((v, i) => v - c.lossB[i]));
    expectRelClose(r.statistic, ref.twoSided.statistic);
    expect(Math.abs(2 * Math.min(r.pValue, 1 - r.pValue) - ref.twoSided.pValue)).toBeLessThan(1e-6);
  });
});

describe('compareForecasts against R dm.test() on daily mean errors (forecast::taylor, 14 days)', () => {
  // A = same half-hour one week earlier, B = one day earlier (R's y[337:1008] and y[625:1296]).
  const y = ref.series;
  const actual = y.slice(672, 1344);
  const a = y.slice(336, 1008);
  const b = y.slice(624, 1296);
  const dayOf = actual.map((_, i) => Math.floor(i / 48));

  test.each([
    ['abs', 0],
    ['squared', 1],
  ] as const)('loss %s', (loss, index) => {
    const c = ref.cases[index];
    const r = compareForecasts(actual, a, b, dayOf, loss);
    expect(r.days).toBe(14);
    expectRelClose(r.statistic, c.statistic);
    expect(Math.abs(r.pValue - c.pValue)).toBeLessThan(1e-6);
  });
});

describe('studentTCdf (jstat) against Student t tables', () => {
  // Upper critical values t(level, df), three decimals, as printed in the t table of the
  // NIST/SEMATECH e-Handbook of Statistical Methods (section 1.3.6.7.2), quoted from memory.
  test.each([
    [6.314, 1, 0.95],
    [2.015, 5, 0.95],
    [2.228, 10, 0.975],
    [2.845, 20, 0.995],
    [2.042, 30, 0.975],
  ])('P(T <= %d) with %d df is %d', (t, df, level) => {
    expect(studentTCdf(t, df)).toBeCloseTo(level, 4);
  });

  // R 4.2.2 pt(x, df) (general-purpose library; call and values in the fixture "studentT").
  test.each(ref.studentT.points.map((p) => [p.x, p.df, p.cdf] as const))('pt(%d, %d) = %d', (x, df, cdf) => {
    expect(Math.abs(studentTCdf(x, df) - cdf)).toBeLessThan(1e-6);
  });
});
