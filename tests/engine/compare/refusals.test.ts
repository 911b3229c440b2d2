import { describe, expect, test } from 'vitest';
import { compareForecasts } from '../../../src/engine/compare/compare-forecasts';
import { dailyLossDifferential } from '../../../src/engine/compare/daily-loss-differential';
import { dieboldMariano } from '../../../src/engine/compare/diebold-mariano';

// What the comparison refuses, word for word: the error contract (design.md) asks for one
// line saying where and what to fix, and several of these inputs would otherwise fail
// later with a message that points elsewhere (a NaN variance, a skipped period).
describe('dieboldMariano(lossDiff, { h }) refusals and the edge of its variance', () => {
  test('names an infinite loss difference', () => {
    expect(() => dieboldMariano([1, -Infinity, 3])).toThrow(
      'Diebold–Mariano test: a loss difference is -Infinity; give finite numbers, or NaN for unknown',
    );
  });

  test('h runs from 1 to n - 1: h = n is refused with the range', () => {
    // HLN (1997) factor sqrt((n + 1 - 2h + h(h-1)/n) / n) is 0 at h = n: no test is left.
    expect(() => dieboldMariano([1, 2, 4], { h: 3 })).toThrow(
      'Diebold–Mariano test: h must be a whole number from 1 to 2 (got 3)',
    );
    expect(dieboldMariano([1, 2, 4], { h: 2 }).n).toBe(3);
  });

  test('a long-run variance of exactly 0 is refused, not divided by (worked by hand)', () => {
    // d = [1, 0, -1, 0]: mean 0, γ0 = 2/4, γ1 = 0, γ2 = (d2·d0 + d3·d1)/4 = -1/4;
    // h = 3: γ0 + 2γ1 + 2γ2 = 0 (Diebold & Mariano 1995, long-run variance Σ|k|<h γk).
    expect(() => dieboldMariano([1, 0, -1, 0], { h: 3 })).toThrow(
      'Diebold–Mariano test: the long-run variance estimate is not positive with h = 3; use a smaller h',
    );
  });
});

describe('dailyLossDifferential refusals name the column lengths and the period', () => {
  test.each([
    [[1, 2], [1], [1, 2], [0, 0], '2, 1, 2 and 2'],
    [[1, 2], [1, 2], [1], [0, 0], '2, 2, 1 and 2'],
    [[1, 2], [1, 2], [1, 2], [0], '2, 2, 2 and 1'],
  ])('lengths %j %j %j %j', (actual, a, b, dayOf, got) => {
    expect(() => dailyLossDifferential(actual, a, b, dayOf, 'abs')).toThrow(
      `forecast comparison requires actual, forecast A, forecast B and day index of the same length (got ${got})`,
    );
  });

  test('names the 1-based period of an infinite value in any of the three columns', () => {
    const message = 'forecast comparison: period 2 has an infinite value; give finite numbers, or NaN for unknown';
    expect(() => dailyLossDifferential([1, Infinity], [1, 1], [1, 1], [0, 0], 'abs')).toThrow(message);
    expect(() => dailyLossDifferential([1, 1], [1, -Infinity], [1, 1], [0, 0], 'abs')).toThrow(message);
    expect(() => dailyLossDifferential([1, 1], [1, 1], [NaN, Infinity], [0, 0], 'abs')).toThrow(message);
  });
});

describe('compareForecasts(actual, a, b, dayOf) with the fewest days it accepts', () => {
  test('two days: the statistic is mean/sqrt(γ0) and p the Cauchy CDF (worked by hand)', () => {
    // daily |A err| - |B err| = [1, 3]: mean 2, γ0 = (1 + 1)/2 = 1, HLN factor sqrt(1/2),
    // var(mean) γ0/2 -> statistic 2 / sqrt(1/2) · sqrt(1/2) = 2. Student t with 1 degree of
    // freedom is the Cauchy distribution: CDF 1/2 + atan(x)/π (textbook formula).
    const r = compareForecasts([10, 10], [11, 13], [10, 10], [0, 1]);
    expect(r.days).toBe(2);
    expect(r.statistic).toBeCloseTo(2, 12);
    expect(r.pValue).toBeCloseTo(0.5 + Math.atan(2) / Math.PI, 7);
  });
});
