import { InputError } from '../errors';
import { groupColumns, type GroupColumns } from '../features/group-columns';
import type { LevelScale } from '../features/level-scale';
import type { Learner } from '../models/learner';
import { learFromInputs, learInputs } from '../models/lear-calibrate';
import type { LearInput } from '../models/lear-features';
import { frameBefore, type DayFrame } from '../series/day-frame';
import type { GroupedModel } from './grouped-model';

/** A learner's inputs for one day: its feature vector, the level scale its prices are read on, and the raw inputs of its LEAR part. */
export interface LearnerInputs {
  x: Float64Array;
  scale: LevelScale;
  lear?: Float64Array;
}

/** The feature group a LEAR input belongs to (lear-features.ts): lagged prices, the target day's or earlier days' drivers, the weekday. */
export function learInputGroup(input: LearInput): string {
  if (input.weekday !== undefined) return 'weekday';
  if (input.source === 'price') return 'price_lags';
  return input.lag === 0 ? 'drivers_target' : 'drivers_lagged';
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
 * `price_level` of its own. The blend's LEAR part reads its own inputs
 * (lear-features.ts); each joins the group it belongs to (learInputGroup),
 * a player of its own where the learner does not use that group.
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
  const lear = learner.state!.lear && learner.state!.learWeight > 0 ? learner.state!.lear : undefined;
  const learGroup = (lear?.design.inputs ?? []).map((input) => {
    const id = learInputGroup(input);
    if (!ids.includes(id)) { ids.push(id); columns.push(undefined); }
    return ids.indexOf(id);
  });
  return {
    groups: ids,
    inputsOf: (frame: DayFrame, d: number) => {
      const f = learner.featuresOf(frame, d);
      if (!f || !lear) return f;
      try {
        return { ...f, lear: learInputs(lear, frameBefore(frame, d)) };
      } catch (err) {
        if (err instanceof InputError) return undefined; // an input LEAR needs is unknown
        throw err;
      }
    },
    switched(d, r, fromD) {
      const x = Float64Array.from(r.x);
      columns.forEach((c, g) => { if (c && fromD(g)) x.set(d.x.subarray(c.from, c.to), c.from); });
      const mixed = d.lear && r.lear ? r.lear.map((v, u) => (fromD(learGroup[u]) ? d.lear![u] : v)) : undefined;
      return { x, scale: fromD(carrier) ? d.scale : r.scale, lear: mixed };
    },
    forecast: (inputs) => learner.forecastFromFeatures(inputs.x, inputs.scale, lear && inputs.lear ? learFromInputs(lear, inputs.lear) : undefined),
  };
}
