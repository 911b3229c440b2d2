import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { bias } from '../../../src/engine/metrics/bias';
import { mae } from '../../../src/engine/metrics/mae';
import { mape } from '../../../src/engine/metrics/mape';
import { mase } from '../../../src/engine/metrics/mase';
import { rmae } from '../../../src/engine/metrics/rmae';
import { rmse } from '../../../src/engine/metrics/rmse';
import { scoreAll } from '../../../src/engine/metrics/score-all';
import { smape } from '../../../src/engine/metrics/smape';

const actual = [40, 55, -3, 0, 120, NaN, 62, 48];
const forecast = [42, 50, 4, 1, 80, 33, NaN, 50];
const reference = [45, 60, 10, 5, 100, 30, 60, NaN];

describe('scoreAll(actual, forecast, { season, insample, reference })', () => {
  test('agrees with each metric called alone', () => {
    const insample = [30, 35, 20, 10, 90, 33, 50, 45];
    const s = scoreAll(actual, forecast, { season: 2, insample, reference });
    expect(s).toEqual({
      periods: 6,
      mae: mae(actual, forecast),
      rmse: rmse(actual, forecast),
      smape: smape(actual, forecast),
      mape: mape(actual, forecast),
      mapeSkipped: 1,
      mase: mase(actual, forecast, insample, 2),
      bias: bias(actual, forecast),
      rmae: rmae(actual, forecast, reference),
      notes: [],
    });
  });

  test('takes the MASE scale from actual itself when no insample is given', () => {
    expect(scoreAll(actual, forecast, { season: 1 }).mase).toBe(mase(actual, forecast, actual, 1));
  });

  test('has no rmae without a reference', () => {
    expect(scoreAll(actual, forecast, { season: 1 })).not.toHaveProperty('rmae');
  });

  test('an undefined score is NaN with a note, the others stay', () => {
    const s = scoreAll([0, 0.5, 0], [1, 1, 1], { season: 1, reference: [0, 0.5, 0] });
    expect(s.mae).toBeCloseTo(2.5 / 3, 12);
    expect(s.mape).toBeNaN();
    expect(s.mapeSkipped).toBe(3);
    expect(s.rmae).toBeNaN();
    expect(s.mase).toBeCloseTo(5 / 3, 12); // MAE 2.5/3 over scale (0.5 + 0.5) / 2
    expect(s.notes).toHaveLength(2);
    expect(s.notes[0]).toMatch(/^MAPE requires/);
    expect(s.notes[1]).toMatch(/^rMAE is undefined/);
  });

  test('MASE is NaN with a note when the file is shorter than one season', () => {
    const s = scoreAll([1, 2, 3], [1, 2, 4], { season: 24 });
    expect(s.mase).toBeNaN();
    expect(s.notes[0]).toMatch(/MASE scale requires/);
  });

  test('bad input throws', () => {
    expect(() => scoreAll([1, 2], [1], { season: 1 })).toThrow(InputError);
    expect(() => scoreAll([NaN], [1], { season: 1 })).toThrow(InputError);
    expect(() => scoreAll([1, 2], [1, 2], { season: 0 })).toThrow(InputError);
    expect(() => scoreAll([1, 2], [1, 2], { season: 1, reference: [1] })).toThrow(
      'rMAE requires actual and reference of the same length (got 2 and 1)',
    );
    expect(() => scoreAll([1, 2], [1, 2], { season: 1, reference: [1, Infinity] })).toThrow(InputError);
    expect(() => scoreAll([1, 2], [1, 2], { season: 1, insample: [1, -Infinity] })).toThrow(InputError);
  });
});

// Error contract (design.md): one line saying where and what to fix, so the message is
// checked word for word; positions count from 1 as a spreadsheet's rows do.
describe('scoreAll says where bad input is', () => {
  test('names the column pair and the lengths when they differ', () => {
    expect(() => scoreAll([1, 2], [1], { season: 1 })).toThrow(
      'scores requires actual and forecast of the same length (got 2 and 1)',
    );
  });

  test('names the column and the 1-based position of an infinite value', () => {
    expect(() => scoreAll([1, 2], [1, Infinity], { season: 1 })).toThrow(
      'scores: forecast value 2 is Infinity; give a finite number, or NaN for unknown',
    );
    expect(() => scoreAll([1, 2], [1, 2], { season: 1, insample: [-Infinity, 1] })).toThrow(
      'MASE: in-sample value 1 is -Infinity; give a finite number, or NaN for unknown',
    );
    expect(() => scoreAll([1, 2, 3], [1, 2, 3], { season: 1, reference: [1, NaN, Infinity] })).toThrow(
      'rMAE: reference value 3 is Infinity; give a finite number, or NaN for unknown',
    );
  });

  test('names a season it refuses', () => {
    expect(() => scoreAll([1, 2], [1, 2], { season: 2.5 })).toThrow(
      'MASE season must be a whole number of periods of at least 1 (got 2.5)',
    );
  });

  test('passes minAbsActual on to MAPE (worked by hand)', () => {
    // guard 1: (|6-5|/5 + |110-100|/100) / 2 = (20 % + 10 %) / 2 = 15 %;
    // guard 10 leaves out actual 5: 10 % over one pair.
    expect(scoreAll([5, 100], [6, 110], { season: 1 }).mape).toBeCloseTo(15, 12);
    const guarded = scoreAll([5, 100], [6, 110], { season: 1, minAbsActual: 10 });
    expect(guarded.mape).toBeCloseTo(10, 12);
    expect(guarded.mapeSkipped).toBe(1);
  });
});
