import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { rmae } from '../../../src/engine/metrics/rmae';

describe('rmae(actual, forecast, reference)', () => {
  test('MAE of forecast over MAE of reference (worked by hand)', () => {
    expect(rmae([10, 20], [11, 19], [12, 22])).toBe(0.5);
  });

  test('uses only periods where actual, forecast and reference are all known', () => {
    // period 2 has no reference, period 3 no forecast: only periods 1 and 4 count
    expect(rmae([10, 20, 30, 40], [11, 0, NaN, 41], [12, NaN, 30, 42])).toBe(0.5);
  });

  test('handles negative and zero prices', () => {
    expect(rmae([-10, 0], [-12, 1], [-4, 3])).toBeCloseTo(3 / 9, 12);
  });

  test('refuses a reference with no error', () => {
    expect(() => rmae([1, 2], [1, 3], [1, 2])).toThrow(/reference forecast has no error/);
  });

  test('refuses different lengths and no complete period', () => {
    expect(() => rmae([1, 2], [1, 2], [1])).toThrow(InputError);
    expect(() => rmae([1], [1], [NaN])).toThrow(
      'rMAE requires at least 1 period where actual, forecast and reference are all known',
    );
  });
});
