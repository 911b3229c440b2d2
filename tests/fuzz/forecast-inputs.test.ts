import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { createModel, forecastAhead, inputFrame, type Learner, type Series } from '../../src/engine';
import { fromScaled, levelScale } from '../../src/engine/features/level-scale';
import { syntheticSeries } from '../support/synthetic';
import { outcome, params } from './support';

/**
 * Forecasts from a trained model when tomorrow's driver rows hold a value
 * far outside anything trained on (a load forecast in kW instead of MW, a
 * sign error, a sentinel such as 999999). The rule: beyond 20 training
 * standard deviations an InputError naming the driver; within them, in any
 * run of hours, forecasts inside the scaled range the model was trained to
 * reach (its widened training range, mapped back to prices).
 *
 * The linear part used to be unbounded before the inverse asinh, so one row
 * ×1000 gave forecasts of 1e90 and more for every hour; its scaled forecast
 * is now held inside the widened training range (linear-ensemble.ts). An
 * earlier version of this test checked its bound only for cases that were
 * all refused first, so it could not fail; the second property fails when
 * that hold is removed (checked).
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
  const largest = () => Math.max(...history.price.filter(Number.isFinite).map(Math.abs));
  const withLoad = (hour: number, value: number): Series => {
    const load = [...history.drivers.load_forecast];
    load[cut + hour] = value;
    return { ...history, drivers: { load_forecast: load } };
  };

  it('is refused beyond 20 standard deviations of its training values', () => {
    const { mean, sd } = model.state!.setup.driverStats.load_forecast;
    fc.assert(fc.property(fc.nat(23), fc.double({ min: 20.01, max: 1e6, noNaN: true }), fc.boolean(), (hour, z, up) => {
      const r = outcome(() => forecastAhead(model, withLoad(hour, mean + (up ? z : -z) * sd), ['load_forecast']));
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.message).toMatch(/driver "load_forecast" is .* more than 20 standard deviations/);
    }), params(20, 91));
  });

  // these cases reach the checks: no refusal below 20 sd, so every forecast is looked at
  it('within 20 standard deviations, in any run of hours, gives forecasts inside the range the model was trained to reach', () => {
    const { mean, sd } = model.state!.setup.driverStats.load_forecast;
    const frame = inputFrame(history);
    const d = frame.price.length;
    // the level scale of the forecast day: median and MAD of the scale window before it (level-scale.ts; 56 days, fewer for a short history)
    const scale = levelScale(frame.price, d, model.state!.setup.scaleWindow)!;
    const { lo, hi } = model.state!.targetRange;
    const day = frame.days[d];
    fc.assert(fc.property(fc.nat(23), fc.integer({ min: 1, max: 24 }), fc.double({ min: 3, max: 19.99, noNaN: true }), fc.boolean(), (from, hours, z, up) => {
      const load = [...history.drivers.load_forecast];
      for (let h = from; h < Math.min(24, from + hours); h++) load[cut + h] = mean + (up ? z : -z) * sd;
      const r = outcome(() => forecastAhead(model, { ...history, drivers: { load_forecast: load } }, ['load_forecast']));
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      expect(day.count).toBe(24); // a 24-hour day: row j is clock slot j
      r.value.rows.forEach((row, j) => {
        expect(row.forecast).toBeGreaterThanOrEqual(fromScaled(lo[j], scale) - 1e-9);
        expect(row.forecast).toBeLessThanOrEqual(fromScaled(hi[j], scale) + 1e-9);
        expect(Math.abs(row.forecast)).toBeLessThanOrEqual(100 * largest());
      });
    }), params(20, 92));
  });
});
