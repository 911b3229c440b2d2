import { describe, expect, test } from 'vitest';
import { compareForecasts } from '../../../src/engine/compare/compare-forecasts';
import { InputError } from '../../../src/engine/errors';
import ref from '../../reference/fixtures/dm-small.json';

const dayOf = [0, 0, 0, 1, 1, 1, 2, 2, 2, 3, 3, 3];
const actual = [40, 55, 61, 38, 52, -4, 45, 60, 66, 0, 49, 58];
const good = [41, 53, 60, 40, 50, 0, 44, 62, 65, 3, 47, 59];
const poor = [45, 50, 70, 30, 60, 10, 50, 52, 60, 8, 40, 66];

describe('compareForecasts(actual, a, b, dayOf, loss)', () => {
  // reference: R 4.2.2, forecast 8.20, dm.test() on the daily mean losses (calls in fixtures/dm-small.json)
  test.each(['abs', 'squared'] as const)('with loss %s equals R dm.test() on the daily mean losses', (loss) => {
    expect(ref.actual).toEqual(actual);
    const r = compareForecasts(actual, good, poor, dayOf, loss);
    expect(r.days).toBe(4);
    expect(Math.abs(r.statistic - ref[loss].statistic)).toBeLessThan(1e-9 * Math.abs(ref[loss].statistic));
    expect(Math.abs(r.pValue - ref[loss].pValue)).toBeLessThan(1e-7);
  });

  test('three days worked by hand', () => {
    // daily |A err| - |B err|: -2, -1.5, -1.5; mean -5/3, γ0 = 1/18, HLN factor sqrt(2/3) -> -10;
    // p = t(2 df) CDF at -10 = 1/2 - 10 / (2 sqrt(102)) (closed form, Abramowitz & Stegun 26.7.3, from memory)
    const r = compareForecasts([10, 20, 10, 20, 10, 20], [11, 20, 10, 21, 12, 20], [13, 18, 14, 20, 10, 25], [0, 0, 1, 1, 2, 2]);
    expect(r.days).toBe(3);
    expect(r.statistic).toBeCloseTo(-10, 10);
    expect(r.pValue).toBeCloseTo(0.5 - 10 / (2 * Math.sqrt(102)), 7);
  });

  test('defaults to absolute loss', () => {
    expect(compareForecasts(actual, good, poor, dayOf)).toEqual(compareForecasts(actual, good, poor, dayOf, 'abs'));
  });

  test('the better forecast gets a small p-value, the worse one a large one', () => {
    expect(compareForecasts(actual, good, poor, dayOf).pValue).toBeLessThan(0.05);
    expect(compareForecasts(actual, poor, good, dayOf).pValue).toBeGreaterThan(0.95);
  });

  test('a forecast compared with itself gives p 0.5', () => {
    expect(compareForecasts(actual, good, good, dayOf).pValue).toBe(0.5);
  });

  test('refuses fewer than 2 days with data', () => {
    const blank = actual.map((v, i) => (dayOf[i] === 0 ? v : NaN));
    expect(() => compareForecasts(blank, good, poor, dayOf)).toThrow(
      new InputError('forecast comparison requires at least 2 delivery days with data (got 1)'),
    );
  });
});
