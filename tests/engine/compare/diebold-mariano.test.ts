import { describe, expect, test } from 'vitest';
import { dieboldMariano } from '../../../src/engine/compare/diebold-mariano';
import { InputError } from '../../../src/engine/errors';

// t CDF with 3 and 5 degrees of freedom in closed form (Abramowitz & Stegun 26.7.3, from memory).
const t3 = (x: number) => {
  const th = Math.atan(x / Math.sqrt(3));
  return 0.5 + (th + Math.sin(th) * Math.cos(th)) / Math.PI;
};
const t5 = (x: number) => {
  const th = Math.atan(x / Math.sqrt(5));
  const c = Math.cos(th);
  return 0.5 + (th + Math.sin(th) * (c + (2 / 3) * c ** 3)) / Math.PI;
};

describe('dieboldMariano(lossDiff, { h })', () => {
  test('h = 1: HLN-corrected statistic and one-sided p (worked by hand)', () => {
    // mean -1, γ0 = 3.5/4, var(mean) = 0.875/4, HLN factor sqrt(3/4)
    const expected = (-1 / Math.sqrt(0.875 / 4)) * Math.sqrt(0.75);
    const r = dieboldMariano([-1, -2, 0.5, -1.5]);
    expect(r.n).toBe(4);
    expect(r.statistic).toBeCloseTo(expected, 12);
    expect(r.pValue).toBeCloseTo(t3(expected), 7);
  });

  test('h = 2 adds the lag-1 autocovariance (worked by hand)', () => {
    // mean -1, γ0 = 11/3, γ1 = -1/3, long-run variance 3, var(mean) 1/2,
    // HLN factor sqrt((6 + 1 - 4 + 2/6) / 6) = sqrt(5)/3 -> statistic -sqrt(10)/3
    const r = dieboldMariano([-1, -2, -3, 1, 2, -3], { h: 2 });
    expect(r.statistic).toBeCloseTo(-Math.sqrt(10) / 3, 12);
    expect(r.pValue).toBeCloseTo(t5(-Math.sqrt(10) / 3), 7);
  });

  test('A better (mean d < 0) gives p < 0.5, and swapping A and B gives 1 - p', () => {
    const d = [-3, -1, 0.5, -2, -4, 1, -2.5];
    const ab = dieboldMariano(d);
    const ba = dieboldMariano(d.map((v) => -v));
    expect(ab.pValue).toBeLessThan(0.5);
    expect(ba.statistic).toBeCloseTo(-ab.statistic, 12);
    expect(ab.pValue + ba.pValue).toBeCloseTo(1, 7);
  });

  test('does not depend on the unit of the loss', () => {
    const d = [-3, -1, 0.5, -2, -4, 1, -2.5];
    expect(dieboldMariano(d.map((v) => v * 1000)).statistic).toBeCloseTo(dieboldMariano(d).statistic, 9);
  });

  test('skips NaN entries', () => {
    expect(dieboldMariano([-1, NaN, -2, 0.5, -1.5, NaN])).toEqual(dieboldMariano([-1, -2, 0.5, -1.5]));
  });

  test('identical losses in every period: statistic 0, p 0.5', () => {
    expect(dieboldMariano([0, 0, 0])).toEqual({ statistic: 0, pValue: 0.5, n: 3 });
  });

  test('refuses a constant nonzero differential (variance 0)', () => {
    expect(() => dieboldMariano([-2, -2, -2])).toThrow(/undefined: the loss difference is -2 in every period/);
  });

  test('refuses a negative long-run variance estimate for h > 1', () => {
    // mean 0.5, γ0 = 1.25, γ1 = -0.9375 -> 1.25 - 1.875 < 0 (worked by hand)
    expect(() => dieboldMariano([1, -1, 2, 0], { h: 2 })).toThrow(/long-run variance estimate is not positive/);
  });

  test('refuses fewer than 2 values, a bad h and ±Infinity', () => {
    expect(() => dieboldMariano([1])).toThrow(
      new InputError('Diebold–Mariano test requires at least 2 loss differences (got 1)'),
    );
    expect(() => dieboldMariano([1, NaN])).toThrow(InputError);
    for (const h of [0, 1.5, 3]) expect(() => dieboldMariano([1, 2, 3], { h })).toThrow(InputError);
    expect(() => dieboldMariano([1, Infinity, 3])).toThrow(InputError);
  });
});

describe('dieboldMariano(lossDiff) at the ends of the double range (found by tests/fuzz/compare)', () => {
  const d = [-1, -2, 0.5, -1.5];
  test('loss differences of 1e200 give the same statistic as the same numbers in units (squares overflowed: statistic 0, p 0.5)', () => {
    const base = dieboldMariano(d);
    const big = dieboldMariano(d.map((v) => v * 1e200));
    expect(big.statistic).toBeCloseTo(base.statistic, 10);
    expect(big.pValue).toBeCloseTo(base.pValue, 10);
  });

  test('tiny loss differences are tested, not refused (squares underflowed to a zero variance)', () => {
    expect(dieboldMariano(d.map((v) => v * 1e-300)).statistic).toBeCloseTo(dieboldMariano(d).statistic, 10);
    expect(dieboldMariano([0, -5e-324]).n).toBe(2);
  });
});
