import { groupColumns, type GroupColumns } from '../features/group-columns';
import type { LevelScale } from '../features/level-scale';
import type { Learner } from '../models/learner';
import type { DayFrame } from '../series/day-frame';
import type { GroupedModel } from './grouped-model';

/** A learner's inputs for one day: its feature vector and the level scale its prices are read on. */
export interface LearnerInputs {
  x: Float64Array;
  scale: LevelScale;
}

/** The price groups, in the order in which one of them is chosen to carry the level scale. */
const SCALE_CARRIERS = ['price_lags', 'price_d1_stats', 'price_changes', 'price_year_ago'];

/** The player that carries the level scale when the model uses no price group. */
export const PRICE_LEVEL_GROUP = 'price_level';

/**
 * The Learner (blend, neural, linear) as a grouped model, through its
 * public methods only (featuresOf, forecastFromFeatures, state.setup).
 * The players are the model's feature groups. The level scale (median and
 * spread of the recent prices, level-scale.ts) is an input too: every price
 * feature and the forecast itself are read on it. It travels with the group
 * `price_lags` (the recent prices it summarises), or with the first other
 * price group the model uses; a model without price groups gets a player
 * `price_level` of its own.
 */
export function learnerModel(learner: Learner): GroupedModel<LearnerInputs> {
  const setup = learner.state!.setup;
  const columns: (GroupColumns | undefined)[] = groupColumns(setup);
  const ids = columns.map((c) => c!.group as string);
  let carrier = SCALE_CARRIERS.map((g) => ids.indexOf(g)).find((i) => i >= 0);
  if (carrier === undefined) {
    ids.push(PRICE_LEVEL_GROUP);
    columns.push(undefined);
    carrier = ids.length - 1;
  }
  return {
    groups: ids,
    inputsOf: (frame: DayFrame, d: number) => learner.featuresOf(frame, d),
    switched(d, r, fromD) {
      const x = Float64Array.from(r.x);
      columns.forEach((c, g) => { if (c && fromD(g)) x.set(d.x.subarray(c.from, c.to), c.from); });
      return { x, scale: fromD(carrier) ? d.scale : r.scale };
    },
    forecast: (inputs) => learner.forecastFromFeatures(inputs.x, inputs.scale),
  };
}
