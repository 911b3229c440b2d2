import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mapeGuarded } from '../../../src/engine/metrics/mape-guarded';

describe('mapeGuarded(actual, forecast, { minAbsActual })', () => {
  test('100 * mean(|F - A| / |A|) over |A| >= 1, counting the pairs it leaves out', () => {
    // |90-100|/100 = 0.1, |-40-(-50)|/50 = 0.2 -> 15 %; 0.2 is below the guard
    expect(mapeGuarded([100, 0.2, -50], [90, 5, -40])).toEqual({ value: expect.closeTo(15, 12), used: 2, skipped: 1 });
  });

  test('leaves out zero prices instead of dividing by zero', () => {
    const result = mapeGuarded([0, 0, 20], [5, -5, 25]);
    expect(result.value).toBeCloseTo(25, 12);
    expect(result.skipped).toBe(2);
  });

  test('minAbsActual moves the guard; |A| equal to the guard is kept', () => {
    expect(mapeGuarded([5, 10], [6, 11], { minAbsActual: 10 })).toEqual({ value: expect.closeTo(10, 12), used: 1, skipped: 1 });
    expect(mapeGuarded([0.5], [0.25], { minAbsActual: 0.1 }).value).toBeCloseTo(50, 12);
  });

  test('NaN pairs are skipped and not counted as left out by the guard', () => {
    expect(mapeGuarded([100, NaN, 0.5], [110, 1, 1])).toEqual({ value: expect.closeTo(10, 12), used: 1, skipped: 1 });
  });

  test('refuses when every actual value is below the guard, pointing to sMAPE', () => {
    expect(() => mapeGuarded([0, 0.3, -0.9], [1, 2, 3])).toThrow(
      new InputError(
        'MAPE requires at least 1 actual value with |actual| >= 1 (all 3 are closer to zero); use sMAPE or MAE for prices near zero',
      ),
    );
  });

  test('refuses a guard that is not a positive number', () => {
    for (const minAbsActual of [0, -1, NaN, Infinity]) {
      expect(() => mapeGuarded([10], [11], { minAbsActual })).toThrow(InputError);
    }
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => mapeGuarded([1, 2], [1])).toThrow(InputError);
    expect(() => mapeGuarded([NaN], [1])).toThrow('MAPE requires at least 1 pair of actual and forecast values');
  });
});
