import { describe, expect, it } from 'vitest';
import {
  dayContributions, explainAhead, frameBefore, groupColumns, inputFrame, learnerModel, withDriverStep,
  type GroupedModel, type Series,
} from '../../../src/engine';
import { predictRidge } from '../../../src/engine/models/ridge';
import { HISTORY_DAYS, periodsOf, trained } from './trained';

const sum = (a: ArrayLike<number>) => Array.from(a).reduce((s, v) => s + v, 0);
const mean = (a: ArrayLike<number>) => sum(a) / a.length;

describe('explainAhead(model, series, drivers, against): contributions add up (efficiency)', () => {
  it.each(['linear', 'neural', 'blend'] as const)('%s: to the change of the mean and of every slot, to 1e-9 relative', (kind) => {
    const { learner, series } = trained(kind);
    for (const against of ['d-1', 'd-7'] as const) {
      const e = explainAhead(learner, series, ['load_forecast'], against);
      expect(e.change).toBe(e.forecastMean - e.referenceForecastMean);
      expect(Math.abs(e.change)).toBeGreaterThan(1e-3);
      expect(Math.abs(sum(e.contributions.map((c) => c.value)) - e.change)).toBeLessThanOrEqual(1e-9 * Math.abs(e.change));
      for (let s = 0; s < 24; s++) {
        const delta = e.forecast[s] - e.reference[s];
        expect(Math.abs(sum(e.contributions.map((c) => c.perSlot[s])) - delta)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(delta), 1));
      }
    }
  });

  it('forecastMean is the mean of the model\'s own forecast of the day; the reference is its forecast of D-1 from that day\'s inputs', () => {
    const { learner, series } = trained('blend');
    // the blend's LEAR part is in play here, so the equality below covers its inputs too
    expect(learner.state!.learWeight).toBeGreaterThan(0);
    const e = explainAhead(learner, series, ['load_forecast']);
    const frame = inputFrame(series);
    expect(e.day).toBe(frame.days[HISTORY_DAYS].date);
    expect(e.referenceDay).toBe(frame.days[HISTORY_DAYS - 1].date);
    expect(e.forecast).toEqual(Array.from(learner.predict(frameBefore(frame, HISTORY_DAYS)).point));
    expect(e.reference).toEqual(Array.from(learner.predict(frameBefore(frame, HISTORY_DAYS - 1)).point));
    const today = periodsOf(series, HISTORY_DAYS - 1);
    expect(e.referenceActualMean).toBeCloseTo(mean(series.price.slice(today.start, today.end)), 12);
    expect(e.referenceError).toBe(e.referenceForecastMean - e.referenceActualMean);
  });
});

describe('a group whose inputs are equal on D and R gets exactly 0', () => {
  it('weekday against d-7 (the same weekday) and month (the same month)', () => {
    const { learner, series } = trained('blend');
    const e = explainAhead(learner, series, ['load_forecast'], 'd-7');
    expect(e.day.slice(0, 7)).toBe(e.referenceDay.slice(0, 7));
    const value = (g: string) => e.contributions.find((c) => c.group === g)!;
    expect(value('weekday').value).toBe(0);
    expect(value('weekday').perSlot.every((v) => v === 0)).toBe(true);
    expect(value('month').value).toBe(0);
    expect(Math.abs(value('drivers_target').value)).toBeGreaterThan(0);
  });

  it('the target-day drivers when tomorrow\'s load forecast is a copy of today\'s', () => {
    const { learner, series } = trained('neural');
    const { start } = periodsOf(series, HISTORY_DAYS);
    const load = [...series.drivers.load_forecast];
    for (let k = 0; k < 24; k++) load[start + k] = load[start - 24 + k];
    const copy: Series = { ...series, drivers: { load_forecast: load } };
    const e = explainAhead(learner, copy, ['load_forecast'], 'd-1');
    expect(e.contributions.find((c) => c.group === 'drivers_target')!.value).toBe(0);
  });
});

describe('the linear case (Lundberg & Lee 2017, NeurIPS: for a linear model the SHAP value is coefficient × input change)', () => {
  it('on the linear learner\'s own ridge coefficients (scaled space), each group gets Σ coefficient × change over its columns', () => {
    const { learner, series } = trained('linear');
    const state = learner.state!;
    const m = 24, members = state.linear, s = state.standardiser;
    const adapter = learnerModel(learner);
    // the linear part before the inverse transform: a model linear in the feature vector
    const linearPart: GroupedModel<{ x: Float64Array }> = {
      groups: adapter.groups,
      inputsOf: (f, d) => adapter.inputsOf(f, d),
      switched: (d, r, fromD) => adapter.switched(d as never, r as never, fromD),
      forecast: ({ x }) => {
        const out = new Float64Array(m);
        for (const member of members) predictRidge(member.weights, s, x, m).forEach((v, c) => { out[c] += v / members.length; });
        return out;
      },
    };
    const frame = inputFrame(series);
    const d = HISTORY_DAYS, r = d - 1;
    const got = dayContributions(linearPart, frame, d, r)!;
    const xd = adapter.inputsOf(frame, d)!.x, xr = adapter.inputsOf(frame, r)!.x;
    const columns = groupColumns(state.setup);
    expect(got.groups).toEqual(columns.map((c) => c.group));
    columns.forEach(({ from, to }, g) => {
      for (let c = 0; c < m; c++) {
        let expected = 0;
        for (let j = from; j < to; j++) {
          const coefficient = members.reduce((a, mem) => a + mem.weights[j * m + c], 0) / members.length / s.sd[j];
          expected += coefficient * (xd[j] - xr[j]);
        }
        expect(got.perSlot[g][c]).toBeCloseTo(expected, 9);
      }
    });
  });
});

describe('determinism', () => {
  it('two blends trained with the same seed give bit-identical explanations; another seed a different one', () => {
    const explain = (seed: number, tag: string) => { const t = trained('blend', seed, tag); return explainAhead(t.learner, t.series, ['load_forecast']); };
    const a = explain(7, 'first');
    expect(explain(7, 'second')).toEqual(a);
    expect(explain(8, 'first').contributions.map((c) => c.value)).not.toEqual(a.contributions.map((c) => c.value));
  });
});

describe('withDriverStep(series, day, step)', () => {
  it('changes the driver on that delivery day only, by a share or an amount', () => {
    const { series } = trained('linear');
    const day = inputFrame(series).days[HISTORY_DAYS].date;
    const up = withDriverStep(series, day, { driver: 'load_forecast', kind: 'percent', amount: 10 });
    const plus = withDriverStep(series, day, { driver: 'load_forecast', kind: 'add', amount: 2 });
    const { start } = periodsOf(series, HISTORY_DAYS);
    expect(up.drivers.load_forecast.slice(0, start)).toEqual(series.drivers.load_forecast.slice(0, start));
    for (let k = start; k < start + 24; k++) {
      expect(up.drivers.load_forecast[k]).toBeCloseTo(series.drivers.load_forecast[k] * 1.1, 12);
      expect(plus.drivers.load_forecast[k]).toBeCloseTo(series.drivers.load_forecast[k] + 2, 12);
    }
    expect(() => withDriverStep(series, day, { driver: 'wind', kind: 'add', amount: 1 })).toThrow(/not among the drivers/);
  });
});
