import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { maseScale } from '../../../src/engine/metrics/mase-scale';

describe('maseScale(series, season)', () => {
  test('mean |y_t - y_(t-season)| (worked by hand)', () => {
    expect(maseScale([1, 3, 2, 6], 2)).toBe(2);
    expect(maseScale([1, 3, 2, 6], 1)).toBeCloseTo(7 / 3, 12); // (2 + 1 + 4) / 3
  });

  test('skips pairs in which either value is NaN', () => {
    // pairs (1,2): 1, (NaN,6): skipped, (2,5): 3, (6,NaN): skipped
    expect(maseScale([1, NaN, 2, 6, 5, NaN], 2)).toBe(2);
  });

  test('handles negative and zero prices', () => {
    expect(maseScale([-10, 0, 10, -5], 2)).toBe(12.5); // (20 + 5) / 2
  });

  test('refuses a bad season', () => {
    for (const season of [0, -1, 1.5, NaN]) expect(() => maseScale([1, 2, 3], season)).toThrow(InputError);
  });

  test('refuses a series shorter than one season plus one', () => {
    expect(() => maseScale([1, 2, 3], 3)).toThrow(
      'MASE scale requires at least 1 pair of in-sample values 3 periods apart (got 3 values)',
    );
  });

  test('refuses a series that repeats exactly (scale 0)', () => {
    expect(() => maseScale([5, 7, 5, 7, 5], 2)).toThrow(/scale is 0/);
  });

  test('refuses ±Infinity', () => {
    expect(() => maseScale([1, Infinity, 3], 1)).toThrow('MASE: in-sample value 2 is Infinity');
  });
});
