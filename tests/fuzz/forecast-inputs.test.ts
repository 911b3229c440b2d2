import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { createModel, forecastAhead, inputFrame, type Learner, type Series } from '../../src/engine';
import { syntheticSeries } from '../support/synthetic';
import { outcome, params } from './support';

/**
 * Forecasts from a trained model when tomorrow's driver rows hold a value
 * far outside anything trained on (a load forecast in kW instead of MW in
 * one row, a sign error, a sentinel such as 999999). The rule: an
 * InputError naming the problem, or forecasts of a plausible size (here:
 * within 100 times the largest price of the history).
 *
 * The linear part used to be unbounded before the inverse asinh, so one row
 * ×1000 gave forecasts of 1e90 and more for every hour; its scaled forecast
 * is now held inside the widened training range (linear-ensemble.ts).
 */

let history: Series;
let model: Learner;
let cut = 0;

beforeAll(() => {
  const full = syntheticSeries(120);
  cut = full.times.findIndex((t) => t >= Date.parse('2025-05-04T00:00:00+02:00'));
  const end = cut + 24;
  history = { ...full, times: full.times.slice(0, end), price: full.price.slice(0, end).map((p, i) => (i >= cut ? NaN : p)), drivers: { load_forecast: full.drivers.load_forecast.slice(0, end) } };
  model = createModel('linear', { seed: 1 }) as Learner;
  model.fit(inputFrame({ ...history, times: history.times.slice(0, cut), price: history.price.slice(0, cut), drivers: { load_forecast: history.drivers.load_forecast.slice(0, cut) } }));
}, 60_000);

describe('a driver value far outside the training range', () => {
  it('is refused, or the forecasts stay within 100x the largest price of the history', () => {
    const largest = Math.max(...history.price.filter(Number.isFinite).map(Math.abs));
    fc.assert(fc.property(fc.nat(23), fc.constantFrom(1000, -1000, 1e6, 100), (hour, factor) => {
      const load = [...history.drivers.load_forecast];
      load[cut + hour] *= factor;
      const r = outcome(() => forecastAhead(model, { ...history, drivers: { load_forecast: load } }, ['load_forecast']));
      if (r.ok) for (const row of r.value.rows) expect(Math.abs(row.forecast)).toBeLessThanOrEqual(100 * largest);
    }), params(20, 91));
  });
});
