import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mase } from '../../../src/engine/metrics/mase';

describe('mase(actual, forecast, insample, season)', () => {
  test('MAE divided by the in-sample seasonal naive MAE (worked by hand)', () => {
    expect(mase([4, 6], [5, 5], [1, 3, 2, 6], 2)).toBe(0.5);
  });

  test('is 1 for the seasonal naive forecast scored on its own in-sample span', () => {
    const y = [30, 50, 42, 61, 28, 55, 45, 58];
    const season = 2;
    expect(mase(y.slice(season), y.slice(0, -season), y, season)).toBeCloseTo(1, 12);
  });

  test('skips NaN pairs and handles negative prices', () => {
    // MAE over (−4 vs −5) and (0 vs 2) = 1.5; scale of [-10, 0, 10, -5] at 2 = 12.5
    expect(mase([-4, NaN, 0], [-5, 1, 2], [-10, 0, 10, -5], 2)).toBeCloseTo(0.12, 12);
  });

  test('refuses different lengths, a bad season and a zero scale', () => {
    expect(() => mase([1, 2], [1], [1, 2, 3], 1)).toThrow(InputError);
    expect(() => mase([1], [1], [1, 2, 3], 0)).toThrow(InputError);
    expect(() => mase([1], [2], [4, 4, 4], 1)).toThrow(/scale is 0/);
  });
});
