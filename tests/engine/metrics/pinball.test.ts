import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mae } from '../../../src/engine/metrics/mae';
import { pinball } from '../../../src/engine/metrics/pinball';

describe('pinball(actual, quantileForecast, tau)', () => {
  test('weights under-forecasts by tau and over-forecasts by 1 - tau (worked by hand)', () => {
    // A - Q = 2 -> 0.9 * 2 = 1.8; A - Q = -3 -> 0.1 * 3 = 0.3; mean 1.05
    expect(pinball([10, 10], [8, 13], 0.9)).toBeCloseTo(1.05, 12);
    expect(pinball([10, 10], [8, 13], 0.1)).toBeCloseTo((0.2 + 2.7) / 2, 12);
  });

  test('at tau = 0.5 it is half the MAE (common practice)', () => {
    const actual = [40, -5, 0, 70];
    const q = [35, 3, 0, 90];
    expect(pinball(actual, q, 0.5)).toBeCloseTo(mae(actual, q) / 2, 12);
  });

  test('skips pairs where actual or forecast is NaN', () => {
    expect(pinball([10, NaN, 10], [8, 0, NaN], 0.9)).toBeCloseTo(1.8, 12);
  });

  test('refuses tau outside (0, 1)', () => {
    for (const tau of [0, 1, -0.1, 1.5, NaN]) {
      expect(() => pinball([1], [1], tau)).toThrow(InputError);
    }
    expect(() => pinball([1], [1], 1)).toThrow('pinball loss requires tau strictly between 0 and 1 (got 1)');
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => pinball([1, 2], [1], 0.5)).toThrow(InputError);
    expect(() => pinball([NaN], [1], 0.5)).toThrow('pinball loss requires at least 1 pair of actual and forecast values');
  });
});
