import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { bias } from '../../../src/engine/metrics/bias';
import { finiteScore } from '../../../src/engine/metrics/finite-score';
import { mae } from '../../../src/engine/metrics/mae';
import { mape } from '../../../src/engine/metrics/mape';
import { mase } from '../../../src/engine/metrics/mase';
import { maseScale } from '../../../src/engine/metrics/mase-scale';
import { pinball } from '../../../src/engine/metrics/pinball';
import { rmae } from '../../../src/engine/metrics/rmae';
import { rmse } from '../../../src/engine/metrics/rmse';

describe('finiteScore(metric, value)', () => {
  test('passes finite scores through and refuses ±Infinity and NaN', () => {
    expect(finiteScore('MAE', 2.5)).toBe(2.5);
    for (const v of [Infinity, -Infinity, NaN]) expect(() => finiteScore('MAE', v)).toThrow(/MAE is too large to compute/);
  });
});

// Found by tests/fuzz/metrics: finite inputs near ±1e308 overflowed inside the metric.
describe('metrics refuse a result that overflows instead of returning it', () => {
  test.each([
    ['mae([-1.7e308], [1.7e308]) gave Infinity', () => mae([-1.7e308], [1.7e308])],
    ['rmse([0], [1e200]) gave Infinity', () => rmse([0], [1e200])],
    ['bias([0, 0], [1.7e308, 1.7e308]) gave Infinity', () => bias([0, 0], [1.7e308, 1.7e308])],
    ['pinball([1e308], [-1e308], 0.5) gave Infinity', () => pinball([1e308], [-1e308], 0.5)],
    ['mape([1], [1.7e308, ...]) gave Infinity', () => mape([1, 1], [1.7e308, 1.7e308])],
    ['rmae with an overflowing reference error gave 0', () => rmae([0, 0], [1, 1], [1.7e308, 1.7e308])],
    ['rmae with an overflowing forecast error gave Infinity', () => rmae([0, 0], [1.7e308, 1.7e308], [1, 1])],
    ['maseScale([0, -1e308, 0], 1) gave Infinity', () => maseScale([0, -1e308, 0], 1)],
    ['mase with an overflowing scale gave 0', () => mase([1], [2], [0, -1e308, 0], 1)],
    ['mase with a subnormal scale gave Infinity', () => mase([0], [1e300], [0, 5e-324], 1)],
  ])('%s', (_what, f) => {
    expect(f).toThrow(InputError);
    expect(f).toThrow(/too large to compute/);
  });

  test('values near the limit that do not overflow still score', () => {
    expect(mae([0, 0], [1e308, 1e307])).toBeCloseTo(5.5e307, -300);
    expect(rmse([0], [1e150])).toBeCloseTo(1e150, -140);
  });
});
