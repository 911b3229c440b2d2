import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { smape } from '../../../src/engine/metrics/smape';

describe('smape(actual, forecast)', () => {
  test('100 * mean(2|F - A| / (|A| + |F|)) (worked by hand)', () => {
    // 2*50/150 = 2/3 and 2*10/210 = 2/21; mean = (2/3 + 2/21) / 2 = 8/21
    expect(smape([100, 100], [50, 110])).toBeCloseTo((100 * 8) / 21, 12);
  });

  test('a pair with actual = forecast = 0 counts as 0 (and is not skipped)', () => {
    expect(smape([100, 0], [50, 0])).toBeCloseTo(100 / 3, 12);
  });

  test('uses absolute values in the denominator, so negative prices stay within 0..200', () => {
    // 2*|(-10) - 10| / (10 + 10) = 2 -> 200 %
    expect(smape([10], [-10])).toBeCloseTo(200, 12);
    // 2*|-5 - (-15)| / (15 + 5) = 1 -> 100 %
    expect(smape([-15], [-5])).toBeCloseTo(100, 12);
    // actual 0, forecast nonzero: 2|F| / |F| = 2 -> 200 %
    expect(smape([0], [7])).toBeCloseTo(200, 12);
  });

  test('skips pairs where actual or forecast is NaN', () => {
    expect(smape([100, NaN, 100], [50, 3, NaN])).toBeCloseTo(200 / 3, 12);
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => smape([1, 2], [1])).toThrow(InputError);
    expect(() => smape([NaN], [1])).toThrow('sMAPE requires at least 1 pair of actual and forecast values');
  });
});

describe('smape(actual, forecast) near the largest doubles (found by tests/fuzz/metrics)', () => {
  test('smape([1e308], [1.7e308]) is 2 * 0.7 / 2.7, not 0 (|A| + |F| overflowed to Infinity)', () => {
    expect(smape([1e308], [1.7e308])).toBeCloseTo((100 * 2 * 0.7) / 2.7, 10);
    expect(smape([-1.5e308], [1.5e308])).toBeCloseTo(200, 12);
  });

  test('a subnormal forecast against 0 is still 200 %', () => {
    expect(smape([0], [-5e-324])).toBe(200);
  });
});
