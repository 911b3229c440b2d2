import { describe, expect, test } from 'vitest';
import { compareForecasts } from '../../../src/engine/compare/compare-forecasts';
import { dailyLossDifferential } from '../../../src/engine/compare/daily-loss-differential';
import { InputError } from '../../../src/engine/errors';

describe('dailyLossDifferential(actual, a, b, dayOf, loss)', () => {
  test('absolute loss: per day, mean |A err| minus mean |B err| (worked by hand)', () => {
    // day 0: (0 - 1 + 1 - 0) / 2 = 0; day 1: 0 - 1 = -1
    expect(dailyLossDifferential([1, 2, 3], [1, 3, 3], [2, 2, 2], [0, 0, 1], 'abs')).toEqual({
      days: [0, 1],
      diff: [0, -1],
    });
  });

  test('squared loss (worked by hand)', () => {
    // day 5: ((2^2 - 1^2) + (0 - 3^2)) / 2 = -3
    expect(dailyLossDifferential([10, 20], [12, 20], [11, 23], [5, 5], 'squared')).toEqual({ days: [5], diff: [-3] });
  });

  test('skips periods where actual, A or B is NaN and drops days with none left', () => {
    const r = dailyLossDifferential(
      [10, 10, NaN, 10, 10],
      [11, NaN, 10, 10, 14],
      [12, 10, 10, NaN, 10],
      [0, 0, 1, 2, 3],
      'abs',
    );
    expect(r).toEqual({ days: [0, 3], diff: [-1, 4] });
  });

  test('returns days in ascending order whatever the order of the periods', () => {
    expect(dailyLossDifferential([1, 1, 1], [2, 1, 4], [1, 1, 1], [7, 3, 7], 'abs')).toEqual({
      days: [3, 7],
      diff: [0, 2],
    });
  });

  test('averages over however many periods a day has (23- and 25-hour days)', () => {
    const dayOf = [...Array(23).fill(0), ...Array(25).fill(1)];
    const actual = dayOf.map(() => 50);
    const a = dayOf.map((day, i) => (day === 0 ? 50 : i === 23 ? 75 : 50)); // one 25-error on day 1
    const b = dayOf.map(() => 51);
    const r = dailyLossDifferential(actual, a, b, dayOf, 'abs');
    expect(r.days).toEqual([0, 1]);
    expect(r.diff[0]).toBeCloseTo(-1, 12);
    expect(r.diff[1]).toBeCloseTo(25 / 25 - 1, 12);
  });

  test('handles negative prices', () => {
    expect(dailyLossDifferential([-20, -5], [-18, -5], [-25, 0], [0, 0], 'abs').diff).toEqual([-4]);
  });

  test('refuses bad input', () => {
    expect(() => dailyLossDifferential([1, 2], [1, 2], [1], [0, 0], 'abs')).toThrow(InputError);
    expect(() => dailyLossDifferential([1], [1], [1], [0.5], 'abs')).toThrow(/day index 1 is 0.5/);
    expect(() => dailyLossDifferential([1], [1], [1], [0], 'log' as 'abs')).toThrow(
      'unknown loss "log"; use "abs" or "squared"',
    );
    expect(() => dailyLossDifferential([1], [Infinity], [1], [0], 'abs')).toThrow(InputError);
    expect(() => dailyLossDifferential([NaN], [1], [1], [0], 'abs')).toThrow(/at least 1 period/);
  });
});

describe('dailyLossDifferential with losses that overflow (found by tests/fuzz/compare)', () => {
  test('refuses instead of handing on a NaN day (squared errors of 1e200 gave Infinity - Infinity)', () => {
    const f = () => dailyLossDifferential([1e200, 0], [0, 1], [0, 2], [0, 1], 'squared');
    expect(f).toThrow(InputError);
    expect(f).toThrow(/losses of day 0 are too large/);
    expect(() => compareForecasts([1e200, 0, 0], [0, 1, 1], [0, 2, 3], [0, 1, 2], 'squared')).toThrow(/too large/);
  });

  test('absolute losses of the same values still work', () => {
    expect(dailyLossDifferential([1e200, 0], [0, 1], [0, 2], [0, 1], 'abs').diff).toEqual([0, -1]);
  });
});
