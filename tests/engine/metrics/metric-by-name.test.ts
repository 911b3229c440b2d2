import { describe, expect, test } from 'vitest';
import { InputError } from '../../../src/engine/errors';
import { bias } from '../../../src/engine/metrics/bias';
import { mae } from '../../../src/engine/metrics/mae';
import { mape } from '../../../src/engine/metrics/mape';
import { mase } from '../../../src/engine/metrics/mase';
import { METRIC_NAMES, metricByName } from '../../../src/engine/metrics/metric-by-name';
import { pinball } from '../../../src/engine/metrics/pinball';
import { rmae } from '../../../src/engine/metrics/rmae';
import { rmse } from '../../../src/engine/metrics/rmse';
import { smape } from '../../../src/engine/metrics/smape';

const actual = [40, 55, -3, 0, 120, 62];
const forecast = [42, 50, 4, 1, 80, 60];
const reference = [45, 60, 10, 5, 100, 30];

describe('metricByName(name, actual, forecast, options)', () => {
  test('dispatches each name to its metric', () => {
    const options = { season: 2, reference, tau: 0.25 };
    expect(metricByName('MAE', actual, forecast, options)).toBe(mae(actual, forecast));
    expect(metricByName('RMSE', actual, forecast, options)).toBe(rmse(actual, forecast));
    expect(metricByName('SMAPE', actual, forecast, options)).toBe(smape(actual, forecast));
    expect(metricByName('MAPE', actual, forecast, options)).toBe(mape(actual, forecast));
    expect(metricByName('MASE', actual, forecast, options)).toBe(mase(actual, forecast, actual, 2));
    expect(metricByName('RMAE', actual, forecast, options)).toBe(rmae(actual, forecast, reference));
    expect(metricByName('BIAS', actual, forecast, options)).toBe(bias(actual, forecast));
    expect(metricByName('PINBALL', actual, forecast, options)).toBe(pinball(actual, forecast, 0.25));
  });

  test('is case-insensitive and ignores surrounding spaces', () => {
    expect(metricByName('sMAPE', actual, forecast)).toBe(smape(actual, forecast));
    expect(metricByName(' rmae ', actual, forecast, { reference })).toBe(rmae(actual, forecast, reference));
  });

  test('passes insample and minAbsActual through', () => {
    const insample = [10, 20, 15, 30, 12];
    expect(metricByName('mase', actual, forecast, { season: 1, insample })).toBe(mase(actual, forecast, insample, 1));
    expect(metricByName('mape', actual, forecast, { minAbsActual: 50 })).toBe(
      mape(actual, forecast, { minAbsActual: 50 }),
    );
  });

  test('refuses an unknown name, listing the valid ones', () => {
    expect(() => metricByName('MSE', actual, forecast)).toThrow(
      new InputError('unknown metric "MSE"; use one of MAE, RMSE, SMAPE, MAPE, MASE, RMAE, BIAS, PINBALL'),
    );
    expect(METRIC_NAMES).toHaveLength(8);
  });

  test('refuses a metric whose option is missing', () => {
    expect(() => metricByName('MASE', actual, forecast)).toThrow(/MASE needs a season/);
    expect(() => metricByName('RMAE', actual, forecast)).toThrow(/RMAE needs a reference/);
    expect(() => metricByName('PINBALL', actual, forecast)).toThrow(/PINBALL needs tau/);
  });
});
