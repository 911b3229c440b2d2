import { describe, expect, it } from 'vitest';
import {
  createModel, explainAhead, frameBefore, groupColumns, groupedModelOf, inputFrame, InputError, learnerModel, Lear, PRICE_LEVEL_GROUP, type Learner,
} from '../../../src/engine';
import { HISTORY_DAYS, SMALL, tomorrowSeries, trained } from './trained';

describe('learnerModel(learner)', () => {
  it('has the model\'s feature groups as players; price_lags carries the level scale', () => {
    const { learner, series } = trained('linear');
    const model = learnerModel(learner);
    const columns = groupColumns(learner.state!.setup);
    expect(model.groups).toEqual(columns.map((c) => c.group));
    const frame = inputFrame(series);
    const d = model.inputsOf(frame, HISTORY_DAYS)!, r = model.inputsOf(frame, HISTORY_DAYS - 1)!;
    const lags = model.groups.indexOf('price_lags');
    const mixed = model.switched(d, r, (g) => g === lags);
    expect(mixed.scale).toBe(d.scale);
    const { from, to } = columns[lags];
    mixed.x.forEach((v, j) => expect(v).toBe(j >= from && j < to ? d.x[j] : r.x[j]));
    expect(model.switched(d, r, () => true)).toEqual(d);
    expect(model.switched(d, r, () => false)).toEqual(r);
    expect(Array.from(model.forecast(d))).toEqual(Array.from(learner.predict(frameBefore(frame, HISTORY_DAYS)).point));
  });

  it('gives a model without price groups a player price_level for the scale, and its contributions still add up', () => {
    const series = tomorrowSeries();
    const learner = createModel('linear', { ...SMALL, groups: ['drivers_target', 'weekday'] }) as Learner;
    learner.fit(frameBefore(inputFrame(series), HISTORY_DAYS));
    expect(learnerModel(learner).groups).toEqual(['drivers_target', 'weekday', PRICE_LEVEL_GROUP]);
    const e = explainAhead(learner, series, ['load_forecast']);
    expect(Math.abs(e.contributions.reduce((s, c) => s + c.value, 0) - e.change)).toBeLessThanOrEqual(1e-9 * Math.abs(e.change));
  });
});

describe('groupedModelOf(model)', () => {
  it('refuses baselines, lear and an untrained learner with an InputError', () => {
    for (const name of ['naive-day', 'naive-week', 'weekday-rule']) {
      expect(() => groupedModelOf(createModel(name))).toThrow(/cannot be explained: only the learned models/);
    }
    expect(() => groupedModelOf(new Lear())).toThrow(InputError);
    expect(() => groupedModelOf(createModel('blend'))).toThrow(/has not been trained yet/);
  });

  it('explainAhead refuses a reference day without enough history before it', () => {
    const { learner, series } = trained('linear');
    // keep only the level scale's window and 4 days more: D-7 then lacks days of its level scale
    const frame = inputFrame(series);
    const cut = frame.days[HISTORY_DAYS - (learner.state!.setup.scaleWindow + 4)].start;
    const short = { ...series, times: series.times.slice(cut), price: series.price.slice(cut), drivers: { load_forecast: series.drivers.load_forecast.slice(cut) } };
    expect(() => explainAhead(learner, short, ['load_forecast'], 'd-7')).toThrow(/too little price history/);
    expect(() => explainAhead(learner, series, ['load_forecast'], 'd-3' as never)).toThrow(/against must be d-1 or d-7/);
  });

  it('explainAhead checks the reference day\'s inputs as a forecast would: a mistyped driver there is refused', () => {
    const { learner, series } = trained('linear');
    const today = inputFrame(series).days[HISTORY_DAYS - 1];
    const load = [...series.drivers.load_forecast];
    load[today.start + 3] = 1e6;
    expect(() => explainAhead(learner, { ...series, drivers: { load_forecast: load } }, ['load_forecast'])).toThrow(/driver "load_forecast" is 1000000 in slot 4, more than 20 standard deviations/);
  });
});
