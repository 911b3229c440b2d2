import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mae } from '../../../src/engine/metrics/mae';
import { rmse } from '../../../src/engine/metrics/rmse';

describe('rmse(actual, forecast)', () => {
  test('root mean squared error (worked by hand: sqrt((9 + 16) / 2))', () => {
    expect(rmse([0, 0], [3, -4])).toBeCloseTo(Math.sqrt(12.5), 12);
  });

  test('skips pairs where actual or forecast is NaN', () => {
    expect(rmse([0, NaN, 0, 7], [3, 1, -4, NaN])).toBeCloseTo(Math.sqrt(12.5), 12);
  });

  test('handles negative prices', () => {
    expect(rmse([-50, -10], [-47, -14])).toBeCloseTo(Math.sqrt(12.5), 12);
  });

  test('is never below MAE (common practice: quadratic mean >= arithmetic mean)', () => {
    const actual = [40, 55, -3, 0, 120];
    const forecast = [42, 50, 4, 1, 80];
    expect(rmse(actual, forecast)).toBeGreaterThanOrEqual(mae(actual, forecast));
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => rmse([1], [1, 2])).toThrow(InputError);
    expect(() => rmse([NaN, NaN], [1, 2])).toThrow('RMSE requires at least 1 pair of actual and forecast values');
  });
});
