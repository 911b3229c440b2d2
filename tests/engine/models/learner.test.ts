import { describe, expect, it } from 'vitest';
import { createModel, inputFrame, Learner, runBacktest, type ModelOptions, type Series } from '../../../src/engine';
import { syntheticSeries } from '../../support/synthetic';

const SMALL: ModelOptions = { seed: 4, network: { hiddenLayers: [6], learningRate: 0.05, momentum: 0.5, iterations: 15, ensemble: 2, checkEvery: 5, patience: 2 } };
const series = syntheticSeries(140);
const testStart = '2025-05-01';

function backtest(kind: string, s: Series, retrainEvery: number) {
  const model = createModel(kind, SMALL);
  return runBacktest(model, inputFrame(s), s, { testStart, retrainEvery }).rows;
}

describe('Learner (blend, neural, linear) in a backtest', () => {
  it.each([
    ['linear', 1], ['linear', 0], ['neural', 3], ['blend', 2],
  ])('%s with retrain-every %d: prices at or after day D never change a forecast before D', (kind, every) => {
    const cut = series.times.findIndex((t) => t >= Date.parse('2025-05-10T00:00:00+02:00'));
    const changed: Series = { ...series, price: series.price.map((p, i) => (i >= cut ? -p * 2 + 500 : p)) };
    const a = backtest(kind, series, every);
    const b = backtest(kind, changed, every);
    const before = (r: { time: number }) => r.time < series.times[cut];
    const fa = a.filter(before), fb = b.filter(before);
    expect(fa.length).toBeGreaterThan(200);
    expect(fb.map((r) => [r.forecast, r.lower, r.upper])).toEqual(fa.map((r) => [r.forecast, r.lower, r.upper]));
    // and the change does reach the days after it, so the check can fail
    expect(b.filter((r) => !before(r)).map((r) => r.forecast)).not.toEqual(a.filter((r) => !before(r)).map((r) => r.forecast));
  });

  it('gives bit-identical forecasts for the same data and seed', () => {
    expect(backtest('blend', series, 7)).toEqual(backtest('blend', series, 7));
  });

  it('beats naive-week clearly on a series whose price follows its driver', () => {
    const model = createModel('linear', SMALL);
    const { summary } = runBacktest(model, inputFrame(series), series, { testStart, retrainEvery: 1 });
    expect(summary.rmae).toBeLessThan(0.85);
    expect(summary.coverage).toBeGreaterThan(0.7);
  });

  it('refuses to train on too little history and to forecast without the drivers it needs', () => {
    const short = syntheticSeries(60);
    expect(() => createModel('linear', SMALL).fit(inputFrame(short))).toThrow(/training needs at least 56 usable days/);
    const model = createModel('linear', SMALL) as Learner;
    const frame = inputFrame(series);
    model.fit({ ...frame, price: frame.price.slice(0, 120), days: frame.days.slice(0, 121), drivers: { load_forecast: frame.drivers.load_forecast.slice(0, 120) } });
    expect(() => model.predict({ ...frame, price: frame.price.slice(0, 120), days: frame.days.slice(0, 121), drivers: { load_forecast: frame.drivers.load_forecast.slice(0, 120) } }))
      .toThrow(/driver "load_forecast" is missing/);
  });

  it('checks its settings with plain messages', () => {
    expect(() => createModel('neural', { network: { ...SMALL.network!, momentum: 1 } })).toThrow(/momentum must be below 1/);
    expect(() => createModel('blend', { coverage: 1.2 })).toThrow(/coverage must be below 1/);
  });
});
