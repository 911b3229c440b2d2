import type { DayFrame } from '../series/day-frame';
import type { GroupedModel } from './grouped-model';
import { exactShapley } from './shapley';

/** How the forecast of day D differs from the model's forecast of a reference day R, group by group. */
export interface DayContributions {
  groups: string[];
  /** f(inputs of D), per clock slot */
  forecast: Float64Array;
  /** f(inputs of R), per clock slot */
  reference: Float64Array;
  /** per group: its share of forecast − reference in each slot */
  perSlot: Float64Array[];
  /** per group: its share of the change of the mean over the day's slots */
  contributions: number[];
}

/**
 * Splits f(inputs of D) − f(inputs of R) into one exact Shapley value per
 * input group: the game's players are the groups, a coalition S takes the
 * inputs of D for the groups in S and those of R for the rest, and its
 * value is the model's forecast for that mix (one forward pass each, 2^G in
 * all). The contributions add up to the change in every slot and, as the
 * mean is linear, for the day's mean too. For a model linear in its inputs
 * each group's value is Σ coefficient × input change over its columns
 * (Lundberg & Lee 2017, NeurIPS, the linear case of SHAP). Deterministic:
 * nothing is sampled.
 *
 * @returns undefined when an input of D or R is unknown (too little history)
 */
export function dayContributions<I>(model: GroupedModel<I>, frame: DayFrame, d: number, r: number): DayContributions | undefined {
  const onD = model.inputsOf(frame, d);
  const onR = model.inputsOf(frame, r);
  if (!onD || !onR) return undefined;
  const G = model.groups.length;
  const perSlot = exactShapley(G, (mask) => {
    if (mask === 0) return model.forecast(onR);
    if (mask === (1 << G) - 1) return model.forecast(onD);
    return model.forecast(model.switched(onD, onR, (g) => (mask & (1 << g)) !== 0));
  });
  return {
    groups: [...model.groups],
    forecast: model.forecast(onD),
    reference: model.forecast(onR),
    perSlot,
    contributions: perSlot.map(mean),
  };
}

export function mean(row: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < row.length; i++) s += row[i];
  return s / row.length;
}
