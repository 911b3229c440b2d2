import { describe, expect, test } from 'vitest';
import { bias } from '../../src/engine/metrics/bias';
import { mae } from '../../src/engine/metrics/mae';
import { mape } from '../../src/engine/metrics/mape';
import { mase } from '../../src/engine/metrics/mase';
import { rmse } from '../../src/engine/metrics/rmse';
import { scoreAll } from '../../src/engine/metrics/score-all';
import { smape } from '../../src/engine/metrics/smape';
import small from './fixtures/metrics-small.json';
import smapeRef from './fixtures/metrics-smape.json';
import taylor from './fixtures/metrics-taylor.json';

// Expected values: R 4.2.2 with forecast 8.20, forecast::accuracy(); the exact
// calls and versions are stored in each fixture ("call", "versions") and in
// fixtures/README-metrics.md. accuracy() reports ME = mean(actual - forecast);
// our bias is mean(forecast - actual), so bias = -ME.

function expectRelClose(value: number, expected: number, rel = 1e-10): void {
  expect(Math.abs(value - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

describe('metrics against R forecast::accuracy() on forecast::taylor (weeks 3-4, weekly naive)', () => {
  // R's 1-based y[673:1344] is slice(672, 1344) here, and so on.
  const y = taylor.series;
  const insample = y.slice(0, 672);
  const actual = y.slice(672, 1344);
  const forecast = y.slice(336, 1008);

  test('MAE, RMSE, MAPE, MASE and bias (= -ME)', () => {
    expectRelClose(mae(actual, forecast), taylor.expected.MAE);
    expectRelClose(rmse(actual, forecast), taylor.expected.RMSE);
    expectRelClose(mape(actual, forecast), taylor.expected.MAPE);
    expectRelClose(mase(actual, forecast, insample, taylor.season), taylor.expected.MASE);
    expectRelClose(bias(actual, forecast), -taylor.expected.ME);
  });

  test('scoreAll gives the same numbers', () => {
    const s = scoreAll(actual, forecast, { season: taylor.season, insample });
    expectRelClose(s.mae, taylor.expected.MAE);
    expectRelClose(s.rmse, taylor.expected.RMSE);
    expectRelClose(s.mape, taylor.expected.MAPE);
    expectRelClose(s.mase, taylor.expected.MASE);
    expectRelClose(s.bias, -taylor.expected.ME);
  });

  test('sMAPE against exact rational arithmetic in Python (fixtures/metrics-smape.json)', () => {
    expectRelClose(smape(actual, forecast), smapeRef.taylor.smape);
  });
});

describe('metrics against R forecast::accuracy() on short vectors with negative prices', () => {
  test('MAE, RMSE, MAPE, MASE and bias (= -ME)', () => {
    const { actual, forecast, insample, season, expected } = small;
    expectRelClose(mae(actual, forecast), expected.MAE);
    expectRelClose(rmse(actual, forecast), expected.RMSE);
    // every |actual| here is >= 1, so the guard leaves nothing out and R's plain MAPE applies
    expectRelClose(mape(actual, forecast), expected.MAPE);
    expectRelClose(mase(actual, forecast, insample, season), expected.MASE);
    expectRelClose(bias(actual, forecast), -expected.ME);
  });

  test('sMAPE against exact rational arithmetic in Python (fixtures/metrics-smape.json)', () => {
    expectRelClose(smape(small.actual, small.forecast), smapeRef.small.smape);
  });
});

describe('sMAPE with zero and sign-changing prices', () => {
  test('against Python (exact fractions) and by hand: (0 + 2 + 2 + 6/57) / 4 * 100', () => {
    const { actual, forecast, smape: expected } = smapeRef.zeros;
    expectRelClose(smape(actual, forecast), expected);
    expectRelClose(smape(actual, forecast), ((2 + 2 + 6 / 57) / 4) * 100);
  });
});
