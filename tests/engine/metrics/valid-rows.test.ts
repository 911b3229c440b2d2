import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { validRows } from '../../../src/engine/metrics/valid-rows';

describe('validRows(metric, names, columns)', () => {
  test('keeps only rows where no column is NaN', () => {
    expect(validRows('MAE', ['actual', 'forecast'], [[1, NaN, 3, 4], [2, 2, NaN, -5]])).toEqual([
      [1, 4],
      [2, -5],
    ]);
  });

  test('keeps zero and negative values', () => {
    expect(validRows('MAE', ['actual', 'forecast'], [[0, -3], [-0.5, 0]])).toEqual([
      [0, -3],
      [-0.5, 0],
    ]);
  });

  test('refuses different lengths, naming the lengths', () => {
    expect(() => validRows('MAE', ['actual', 'forecast'], [[1, 2, 3], [1, 2]])).toThrow(
      new InputError('MAE requires actual and forecast of the same length (got 3 and 2)'),
    );
    expect(() => validRows('rMAE', ['actual', 'forecast', 'reference'], [[1], [1], [1, 2]])).toThrow(
      'rMAE requires actual, forecast and reference of the same length (got 1, 1 and 2)',
    );
  });

  test('refuses ±Infinity with its 1-based position', () => {
    expect(() => validRows('RMSE', ['actual', 'forecast'], [[1, 2], [1, -Infinity]])).toThrow(
      'RMSE: forecast value 2 is -Infinity; give a finite number, or NaN for unknown',
    );
  });

  test('refuses when no row is complete', () => {
    expect(() => validRows('MAE', ['actual', 'forecast'], [[NaN, 1], [1, NaN]])).toThrow(
      new InputError('MAE requires at least 1 pair of actual and forecast values'),
    );
    expect(() => validRows('MAE', ['actual', 'forecast'], [[], []])).toThrow(InputError);
    expect(() => validRows('rMAE', ['actual', 'forecast', 'reference'], [[1], [1], [NaN]])).toThrow(
      'rMAE requires at least 1 period where actual, forecast and reference are all known',
    );
  });
});
