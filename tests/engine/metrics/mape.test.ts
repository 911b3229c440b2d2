import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mape } from '../../../src/engine/metrics/mape';

describe('mape(actual, forecast, { minAbsActual })', () => {
  test('percent error over the pairs with |actual| >= 1 (worked by hand)', () => {
    expect(mape([100, 0.2, -50], [90, 5, -40])).toBeCloseTo(15, 12);
  });

  test('counts a negative price by its absolute value', () => {
    expect(mape([-20], [-25])).toBeCloseTo(25, 12);
    expect(mape([-20], [20])).toBeCloseTo(200, 12);
  });

  test('passes minAbsActual to the guard', () => {
    expect(mape([5, 10], [6, 11], { minAbsActual: 6 })).toBeCloseTo(10, 12);
  });

  test('skips NaN pairs; refuses all-zero prices', () => {
    expect(mape([NaN, 50], [1, 55])).toBeCloseTo(10, 12);
    expect(() => mape([0, 0], [1, 1])).toThrow(InputError);
  });

  test('refuses different lengths', () => {
    expect(() => mape([1, 2], [1])).toThrow(InputError);
  });
});
