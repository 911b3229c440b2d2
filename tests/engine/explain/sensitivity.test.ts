import { describe, expect, it } from 'vitest';
import { groupColumns, inputFrame, learnerModel, sensitivityAhead } from '../../../src/engine';
import { predictRidge } from '../../../src/engine/models/ridge';
import { HISTORY_DAYS, trained } from './trained';

describe('sensitivityAhead(model, series, drivers)', () => {
  it('linear learner: the central difference matches the derivative worked out from its coefficients (chain rule through the inverse asinh)', () => {
    const { learner, series } = trained('linear');
    const state = learner.state!;
    const got = sensitivityAhead(learner, series, ['load_forecast']);
    expect(got.day).toBe(inputFrame(series).days[HISTORY_DAYS].date);
    const [load] = got.drivers;
    expect(load.driver).toBe('load_forecast');
    // analytic: moving the load by 1 on every period moves each target-day load column by 1 / sd (driverStats);
    // price_c = mean_k (centre + scale · sinh(z_kc)), so dprice_c = mean_k scale · cosh(z_kc) · dz_kc
    const { x, scale } = learnerModel(learner).inputsOf(inputFrame(series), HISTORY_DAYS)!;
    const cols = groupColumns(state.setup).find((c) => c.group === 'drivers_target')!;
    const sdLoad = state.setup.driverStats.load_forecast.sd;
    const m = 24, s = state.standardiser;
    for (let c = 0; c < m; c++) {
      let expected = 0;
      for (const member of state.linear) {
        const z = predictRidge(member.weights, s, x, m)[c];
        expect(z).toBeGreaterThan(state.targetRange.lo[c]);
        expect(z).toBeLessThan(state.targetRange.hi[c]);
        let dz = 0;
        for (let j = cols.from; j < cols.to; j++) dz += member.weights[j * m + c] / s.sd[j] / sdLoad;
        expected += (scale.scale * Math.cosh(z) * dz) / state.linear.length;
      }
      expect(load.perSlot[c]).toBeCloseTo(expected, 6);
    }
    expect(load.mean).toBeCloseTo(load.perSlot.reduce((a, b) => a + b, 0) / m, 12);
    // the sign a desk expects on this invented market, where the price rises with the load (support/synthetic.ts)
    expect(load.mean).toBeGreaterThan(0);
  });

  it('refuses a baseline', () => {
    const { series } = trained('linear');
    expect(() => sensitivityAhead({ name: 'naive-week', minHistoryDays: 7, fit() {}, predict: () => ({ point: new Float64Array(24) }) }, series, [])).toThrow(/cannot be explained/);
  });
});
