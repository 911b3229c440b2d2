import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { mae } from '../../../src/engine/metrics/mae';

describe('mae(actual, forecast)', () => {
  test('mean absolute error (worked by hand)', () => {
    expect(mae([10, 20, 30], [12, 17, 30])).toBeCloseTo(5 / 3, 12);
  });

  test('skips pairs where actual or forecast is NaN', () => {
    expect(mae([10, NaN, 30, 40], [12, 5, NaN, 44])).toBe(3);
  });

  test('handles zero and negative prices', () => {
    expect(mae([0, -20, 5], [-10, -25, 0])).toBeCloseTo(20 / 3, 12);
  });

  test('is 0 for a perfect forecast and symmetric in its arguments', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -500, max: 3000, noNaN: true }), { minLength: 1 }), (xs) => {
        const shifted = xs.map((x) => x * 0.9 - 3);
        expect(mae(xs, xs)).toBe(0);
        expect(mae(xs, shifted)).toBeCloseTo(mae(shifted, xs), 9);
      }),
    );
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => mae([1, 2], [1])).toThrow(InputError);
    expect(() => mae([NaN], [1])).toThrow('MAE requires at least 1 pair of actual and forecast values');
    expect(() => mae([], [])).toThrow('MAE requires at least 1 pair of actual and forecast values');
  });
});
