import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { bias } from '../../../src/engine/metrics/bias';

describe('bias(actual, forecast)', () => {
  test('is mean(forecast - actual): positive when the forecast is too high', () => {
    expect(bias([10, 20], [12, 21])).toBe(1.5);
    expect(bias([10, 20], [8, 19])).toBe(-1.5);
  });

  test('errors of opposite sign cancel', () => {
    expect(bias([10, 10], [15, 5])).toBe(0);
  });

  test('skips pairs where actual or forecast is NaN; handles negative and zero prices', () => {
    expect(bias([-10, NaN, 0, 3], [-6, 100, 2, NaN])).toBe(3);
  });

  test('refuses different lengths and no complete pair', () => {
    expect(() => bias([1, 2, 3], [1, 2])).toThrow(InputError);
    expect(() => bias([NaN], [NaN])).toThrow('bias requires at least 1 pair of actual and forecast values');
  });
});
