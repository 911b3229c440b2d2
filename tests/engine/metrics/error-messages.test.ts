import { describe, expect, test } from 'vitest';
import { bias } from '../../../src/engine/metrics/bias';
import { mae } from '../../../src/engine/metrics/mae';
import { mapeGuarded } from '../../../src/engine/metrics/mape-guarded';
import { mase } from '../../../src/engine/metrics/mase';
import { maseScale } from '../../../src/engine/metrics/mase-scale';
import { pinball } from '../../../src/engine/metrics/pinball';
import { rmae } from '../../../src/engine/metrics/rmae';
import { rmse } from '../../../src/engine/metrics/rmse';

// The error contract (HELPER rules, design.md: one line saying where and what to fix):
// a metric that cannot give a finite score names itself, so that a user who scores
// many columns at once (LOOM.SCORE, `spotloom score`) knows which score failed.
// Overflow: IEEE 754 doubles end near ±1.8e308, so |1.7e308 - (-1.7e308)| is Infinity.
describe('an overflowing metric names itself in its message', () => {
  test.each([
    ['MAE', () => mae([-1.7e308], [1.7e308])],
    ['RMSE', () => rmse([0], [1e200])],
    ['bias', () => bias([0, 0], [1.7e308, 1.7e308])],
    ['pinball loss', () => pinball([1e308], [-1e308], 0.5)],
    ['MAPE', () => mapeGuarded([1, 1], [1.7e308, 1.7e308])],
    ['MASE scale', () => maseScale([0, -1e308, 0], 1)],
    ['MASE', () => mase([0], [1e300], [0, 5e-324], 1)],
    // rMAE checks each sum and the ratio: an overflowing forecast error, reference
    // error, and a ratio overflowing because the reference error is subnormal.
    ['rMAE', () => rmae([0, 0], [1.7e308, 1.7e308], [1, 1])],
    ['rMAE', () => rmae([0, 0], [1, 1], [1.7e308, 1.7e308])],
    ['rMAE', () => rmae([0], [1e300], [5e-324])],
  ])('%s', (name, f) => {
    expect(f).toThrow(new RegExp(`^${name} is too large to compute`));
  });
});

describe('bad settings are named with the value given', () => {
  test('maseScale names the season it refuses', () => {
    for (const season of [0, -1, 1.5, NaN]) {
      expect(() => maseScale([1, 2, 3, 4], season)).toThrow(
        `MASE season must be a whole number of periods of at least 1 (got ${season})`,
      );
    }
  });

  test('mapeGuarded names the guard it refuses', () => {
    for (const minAbsActual of [0, -1, NaN, Infinity]) {
      expect(() => mapeGuarded([10], [11], { minAbsActual })).toThrow(
        `MAPE minAbsActual must be a positive number (got ${minAbsActual})`,
      );
    }
  });
});
