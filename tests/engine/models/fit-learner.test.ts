import { describe, expect, it } from 'vitest';
import { createModel, inputFrame, type Learner, type Series } from '../../../src/engine';
import { trainingBlocks } from '../../../src/engine/models/blocks';
import { meanAbsError } from '../../../src/engine/models/blend-weights';
import { scaleWindowFor } from '../../../src/engine/models/choose-setup';
import { fitLearner } from '../../../src/engine/models/fit-learner';
import { RECENT_DAYS, recentWeights } from '../../../src/engine/models/recent-weights';
import { fitted, SMALL } from '../../support/small-learner';
import { syntheticSeries } from '../../support/synthetic';

const series = syntheticSeries(160);


/** The series with every price of the last `days` local delivery days changed. */
function newestDaysChanged(s: Series, days: number): Series {
  const frame = inputFrame(s);
  const cut = days === 0 ? s.times.length : frame.days[frame.days.length - days].start;
  return { ...s, price: s.price.map((p, i) => (i >= cut ? p * 1.3 + 7 : p)) };
}

/** fitLearner's own result: the tuning block's choices, before the blend's rolling weights take in the holdout days (Learner.fit). */
const fitOnly = (kind: string, s: Series) => fitLearner(inputFrame(s), (createModel(kind, SMALL) as Learner).settings);

describe('fitLearner: the holdout block takes part in no choice', () => {

  it.each(['linear', 'blend'])('%s: changing the holdout days\' prices leaves every choice and the tuning score as they were', (kind) => {
    const a = fitOnly(kind, series).state;
    const holdout = a.holdout.days;
    expect(holdout).toBe(trainingBlocks(160 - scaleWindowFor(56, 160)).holdout);
    const b = fitOnly(kind, newestDaysChanged(series, holdout)).state;
    expect(b.linear.map((l) => l.lambda)).toEqual(a.linear.map((l) => l.lambda));
    expect([b.neuralWeight, b.learWeight]).toEqual([a.neuralWeight, a.learWeight]);
    expect(b.tuning).toEqual(a.tuning);
    // and the change does reach what is scored on the holdout, so the check can fail
    expect(b.holdout.mae).not.toBe(a.holdout.mae);
  });

  it('bands start from the holdout errors: one per holdout day and slot, in units of the day\'s level scale', () => {
    const state = fitted('linear', series).state!;
    for (const slot of state.residuals.bySlot) expect(slot).toHaveLength(state.holdout.days);
    const b = fitted('linear', newestDaysChanged(series, state.holdout.days)).state!;
    expect(b.residuals.bySlot[0]).not.toEqual(state.residuals.bySlot[0]);
    const c = fitted('linear', newestDaysChanged(series, 0)).state!;
    expect(c.residuals).toEqual(state.residuals);
  });

  it('scores the tuning block in-sample for its choices: the chosen penalties are the best there', () => {
    const state = fitted('linear', series).state!;
    expect(state.tuning.mae).toBeLessThanOrEqual(state.tuning.maeNaiveWeek);
    expect(state.tuning.days).toBe(trainingBlocks(160 - scaleWindowFor(56, 160)).tuning);
  });

  it('the rolling weights start from the newest holdout days: their parts are the holdout forecasts behind the reported scores', () => {
    const { state, recent } = fitOnly('blend', series);
    const holdoutDays = inputFrame(series).price.slice(-state.holdout.days);
    expect(state.holdout.days).toBeLessThanOrEqual(RECENT_DAYS);
    expect(recent.map((d) => Array.from(d.actual))).toEqual(holdoutDays.map((p) => Array.from(p)));
    // the same forecasts the holdout block was scored with, so they are out-of-sample (the test above)
    expect(meanAbsError(recent.map((d) => d.actual), recent.map((d) => d.linear))).toBeCloseTo(state.holdout.maeLinear, 12);
    expect(meanAbsError(recent.map((d) => d.actual), recent.map((d) => d.neural!))).toBeCloseTo(state.holdout.maeNeural, 12);
  });

  it('a fitted blend carries the weights the rolling rule takes from those days, with a note, when they moved', () => {
    // the level jumps in the holdout days (x 1.3 + 7): the parts cope differently, so the rule moves the weights
    const shifted = newestDaysChanged(series, fitOnly('blend', series).state.holdout.days);
    const { state, recent } = fitOnly('blend', shifted);
    const moved = recentWeights(recent, { neural: state.neuralWeight, lear: state.learWeight });
    expect(moved).toBeDefined();
    const learner = fitted('blend', shifted).state!;
    expect({ neural: learner.neuralWeight, lear: learner.learWeight }).toEqual(moved);
    expect(learner.notes.filter((n) => n.startsWith('blend weights'))).toHaveLength(1);
    // without the jump the rule keeps the tuning block's weights, and there is no note
    const calm = fitOnly('blend', series);
    expect(recentWeights(calm.recent, { neural: calm.state.neuralWeight, lear: calm.state.learWeight })).toBeUndefined();
    const kept = fitted('blend', series).state!;
    expect([kept.neuralWeight, kept.learWeight]).toEqual([calm.state.neuralWeight, calm.state.learWeight]);
    expect(kept.notes.some((n) => n.startsWith('blend weights'))).toBe(false);
  });
});
