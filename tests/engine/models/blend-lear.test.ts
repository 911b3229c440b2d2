import { describe, expect, it } from 'vitest';
import {
  createModel, frameBefore, inputFrame, Learner, learnerFromStored, parseStoredModel, runBacktest, storedModelText, toStoredModel,
  type Series,
} from '../../../src/engine';
import { fitted, SMALL } from '../../support/small-learner';
import { syntheticSeries } from '../../support/synthetic';

// The blend's LEAR part (lear-part.ts) and the short histories of issue 11.
const series = syntheticSeries(140);


describe('the blend with a LEAR part', () => {
  const model = fitted('blend', series);
  const state = model.state!;

  it('gives LEAR a weight on this series, so the checks below cover it', () => {
    expect(state.learWeight).toBeGreaterThan(0);
    expect(state.lear).toBeDefined();
    expect(state.neuralWeight + state.learWeight).toBeLessThanOrEqual(1);
    expect(Number.isFinite(state.holdout.maeLear)).toBe(true);
  });

  it('has convex weights that score at least as well on the tuning block as each part alone', () => {
    const t = state.tuning;
    expect(t.mae).toBeLessThanOrEqual(Math.min(t.maeLinear, t.maeNeural, t.maeLear) + 1e-9);
  });

  it('with retrain-every 1: prices at or after day D never change a forecast before D, LEAR part included', () => {
    const testStart = '2025-04-20';
    const cut = series.times.findIndex((t) => t >= Date.parse('2025-05-02T00:00:00+02:00'));
    const changed: Series = { ...series, price: series.price.map((p, i) => (i >= cut ? 300 - p : p)) };
    const run = (s: Series) => runBacktest(createModel('blend', SMALL), inputFrame(s), s, { testStart, retrainEvery: 1 }).rows;
    const a = run(series), b = run(changed);
    const before = (r: { time: number }) => r.time < series.times[cut];
    expect(a.filter(before).length).toBeGreaterThan(200);
    expect(b.filter(before).map((r) => [r.forecast, r.lower, r.upper])).toEqual(a.filter(before).map((r) => [r.forecast, r.lower, r.upper]));
    expect(b.filter((r) => !before(r)).map((r) => r.forecast)).not.toEqual(a.filter((r) => !before(r)).map((r) => r.forecast));
  });

  it('forecasts alike after a save and load (LEAR part within 1e-6, packed weights within 1e-4 of the price range)', () => {
    const frame = inputFrame(series);
    const text = storedModelText(toStoredModel(model, { name: 'blend', zone: 'Europe/Berlin', resolution: 60 }));
    const loaded = learnerFromStored(parseStoredModel(text));
    expect(loaded.state!.learWeight).toBe(state.learWeight);
    const view = frameBefore(frame, frame.days.length - 1);
    const width0 = state.priceRange.hi - state.priceRange.lo;
    const la = loaded.learPartOf(view)!, lb = model.learPartOf(view)!;
    la.forEach((v, k) => expect(Math.abs(v - lb[k])).toBeLessThanOrEqual(1e-6 * width0));
    // the model file packs network and ridge weights to 16 bits (model-file/packed-floats.ts): forecasts move by
    // at most 1e-4 of the training price range; LEAR's coefficients are 32-bit
    const width = state.priceRange.hi - state.priceRange.lo;
    const a = loaded.predict(view).point, b = model.predict(view).point;
    a.forEach((v, k) => expect(Math.abs(v - b[k])).toBeLessThanOrEqual(1e-4 * width));
  });

  it('its LEAR part changes the forecast: without it the linear part takes its weight', () => {
    const frame = inputFrame(series);
    const view = frameBefore(frame, frame.days.length - 1);
    const f = model.featuresOf(view, frame.days.length - 1)!;
    const withLear = model.forecastFromFeatures(f.x, f.scale, model.learPartOf(view));
    expect(Array.from(withLear)).toEqual(Array.from(model.predict(view).point));
    expect(Array.from(model.forecastFromFeatures(f.x, f.scale))).not.toEqual(Array.from(withLear));
  });
});

describe('short histories', () => {
  it.each(['blend', 'neural', 'linear'])('%s trains on 28 days of history and forecasts the 29th, with a note on the shorter level scale', (kind) => {
    const s = syntheticSeries(29);
    const frame = inputFrame(s);
    const model = createModel(kind, SMALL) as Learner;
    expect(model.minHistoryDays).toBe(28);
    const view = frameBefore(frame, 28);
    model.fit(view);
    expect(model.state!.setup.scaleWindow).toBe(7);
    expect(model.state!.notes.join(' ')).toMatch(/level scale over 7 days instead of 56/);
    const f = model.predict(view);
    expect(f.point).toHaveLength(24);
    expect(f.point.every(Number.isFinite)).toBe(true);
  });

  it.each(['blend', 'neural', 'linear'])('%s refuses 27 days with the number needed', (kind) => {
    const frame = inputFrame(syntheticSeries(28));
    expect(() => createModel(kind, SMALL).fit(frameBefore(frame, 27))).toThrow(/needs at least 28 days of price history; the data has 27/);
  });

  it('a backtest with 28 days of history runs, and one with 27 says how many it needs', () => {
    const s = syntheticSeries(60);
    const frame = inputFrame(s);
    const ok = runBacktest(createModel('linear', SMALL), frame, s, { testStart: frame.days[28].date, retrainEvery: 1 });
    expect(ok.summary.periods).toBe(32 * 24);
    expect(() => runBacktest(createModel('linear', SMALL), frame, s, { testStart: frame.days[27].date, retrainEvery: 1 }))
      .toThrow(/leaves 27 days of history before it; model linear needs at least 28/);
  });
});
