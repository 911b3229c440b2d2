import { describe, expect, test } from 'vitest';
import { bestMixWeight, meanAbsError, mix } from '../../../src/engine/models/blend-weights';

const f = (...v: number[]) => Float64Array.from(v);
const rows = (m: Float64Array[]) => m.map((r) => Array.from(r));

// A convex combination w·A + (1 − w)·B of two forecasts, the weight chosen on a grid
// by the score: forecast combination as in Bates & Granger (1969), Oper. Res. Q. 20(4),
// with a grid search instead of their variance formula. Values worked by hand.
describe('mix(a, b, wa)', () => {
  test('weights the first forecast by wa and the second by 1 − wa, per day and slot', () => {
    expect(rows(mix([f(4, 8), f(0, -4)], [f(0, 4), f(8, 0)], 0.25))).toEqual([[1, 5], [6, -1]]);
  });

  test('wa = 0 is the second forecast and wa = 1 the first', () => {
    const a = [f(1, 2)], b = [f(3, 4)];
    expect(mix(a, b, 0)).toBe(b);
    expect(mix(a, b, 1)).toBe(a);
    expect(mix([], [], 0.5)).toEqual([]);
  });
});

describe('bestMixWeight(a, b, score)', () => {
  const a = [f(10)], b = [f(0)];
  const errorTo = (target: number) => (p: Float64Array[]) => Math.abs(p[0][0] - target);

  test('finds the grid weight whose mix scores best', () => {
    expect(bestMixWeight(a, b, errorTo(3))).toBeCloseTo(0.3, 12); // 0.3 · 10 = 3
    expect(bestMixWeight(a, b, errorTo(10))).toBe(1); // the last grid point
    expect(bestMixWeight(a, b, errorTo(0))).toBe(0);
    expect(bestMixWeight(a, b, errorTo(3.6))).toBeCloseTo(0.35, 12); // grid of 0.05: 3.5 is nearest
  });

  test('keeps the earliest weight on a tie, also within rounding (1e-12)', () => {
    expect(bestMixWeight(a, b, () => 1)).toBe(0);
    let calls = 0;
    expect(bestMixWeight(a, b, () => 1 - 1e-14 * calls++)).toBe(0);
    expect(calls).toBe(21); // 0, 0.05, ..., 1
  });
});

describe('meanAbsError(actual, forecast)', () => {
  test('averages |A − F| over every known pair of days × slots', () => {
    // |1 − 2| = 1, (NaN skipped), |3 − 1| = 2, |4 − 4| = 0, (Infinity skipped) -> 3 / 3
    expect(meanAbsError([f(1, NaN), f(3, 4, 5)], [f(2, 5), f(1, 4, Infinity)])).toBe(1);
  });

  test('is NaN when no pair is known', () => {
    expect(meanAbsError([f(NaN)], [f(1)])).toBeNaN();
    expect(meanAbsError([], [])).toBeNaN();
  });
});
