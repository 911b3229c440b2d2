import type { LevelScale } from '../features/level-scale';
import { fromScaled } from '../features/level-scale';
import type { Gram } from '../linalg/gram';
import { RIDGE_LAMBDAS } from './learner-settings';
import { addRidgeDay, predictRidge, ridgeGram, solveRidge } from './ridge';
import type { Standardiser } from './standardiser';
import type { TrainingDay } from './training-days';
import type { UnitRange } from './unit-range';

/**
 * Ridge models on several calibration windows (the last W usable days;
 * 0 = all), averaged. Averaging forecasts across short and long windows is
 * a robust gain in day-ahead forecasting (Hubicka, Marcjasz & Weron 2019,
 * "A note on averaging day-ahead electricity price forecasts across
 * calibration window lengths", IEEE Trans. Sustainable Energy 10(1)).
 * Each window gets its own penalty, chosen on the tuning block (blocks.ts).
 * Measured on our invented markets (npm run bench), windows shorter than a
 * year lost accuracy, so the default pairs the whole history with the last
 * year only.
 */
export interface LinearMember {
  window: number;
  lambda: number;
  weights: Float64Array;
}

export const LINEAR_WINDOWS = [0, 364];

/** Running sums of one member, with the days they hold (oldest first). */
export interface MemberSums {
  gram: Gram;
  days: TrainingDay[];
}

export function windowOf(days: TrainingDay[], window: number): TrainingDay[] {
  return window > 0 ? days.slice(-window) : days;
}

/** Contiguous folds of the blocked cross-validation that chooses each member's penalty. */
export const PENALTY_FOLDS = 5;

/**
 * Chooses each member's penalty by blocked cross-validation over `days`
 * (the member's window of them): the days are cut into PENALTY_FOLDS
 * contiguous folds, each fold is forecast by ridge fits on the other folds,
 * and the penalty with the lowest MAE in price units over all folds wins.
 * Contiguous folds keep neighbouring, correlated days together (blocked
 * cross-validation for dependent data: Bergmeir & Benítez 2012, "On the use
 * of cross-validation for time series predictor evaluation", Information
 * Sciences 191). Every day of `days` serves, so the choice does not hinge on
 * one season's block. A window at least as long as all `totalDays` the
 * members will be refitted on is the expanding one again and is left out.
 *
 * @returns one member per window, fitted on all of `days` with its penalty
 */
export function chooseLinearMembers(days: TrainingDay[], s: Standardiser, m: number, bounds: UnitRange, totalDays = days.length): LinearMember[] {
  const chosen: LinearMember[] = [];
  for (const window of LINEAR_WINDOWS) {
    if (window > 0 && window >= totalDays) continue;
    const part = windowOf(days, window);
    const gram = ridgeGram(part.map((d) => d.x), part.map((d) => d.y!), s);
    const folds = Math.min(PENALTY_FOLDS, part.length);
    const errors = new Float64Array(RIDGE_LAMBDAS.length);
    for (let f = 0; f < folds; f++) {
      const held = part.slice(Math.floor((f * part.length) / folds), Math.floor(((f + 1) * part.length) / folds));
      const rest = { ...gram, xtx: Float64Array.from(gram.xtx), xty: Float64Array.from(gram.xty) };
      for (const d of held) addRidgeDay(rest, s, d.x, d.y!, -1);
      RIDGE_LAMBDAS.forEach((lambda, k) => {
        const weights = solveRidge(rest, lambda);
        for (const d of held) {
          const z = linearPrice([{ window, lambda, weights }], s, d.x, m, d.scale, bounds);
          for (let c = 0; c < m; c++) errors[k] += Math.abs(fromScaled(d.y![c], d.scale) - z[c]);
        }
      });
    }
    let best = 0;
    for (let k = 1; k < errors.length; k++) if (errors[k] < errors[best]) best = k;
    chosen.push({ window, lambda: RIDGE_LAMBDAS[best], weights: solveRidge(gram, RIDGE_LAMBDAS[best]) });
  }
  return chosen;
}

/** The chosen members (window and penalty) fitted again on `days`, with their running sums. */
export function refitLinearMembers(chosen: LinearMember[], days: TrainingDay[], s: Standardiser): { members: LinearMember[]; sums: MemberSums[] } {
  const members: LinearMember[] = [], sums: MemberSums[] = [];
  for (const { window, lambda } of chosen) {
    const part = windowOf(days, window);
    const gram = ridgeGram(part.map((d) => d.x), part.map((d) => d.y!), s);
    members.push({ window, lambda, weights: solveRidge(gram, lambda) });
    sums.push({ gram, days: [...part] });
  }
  return { members, sums };
}

/**
 * The members' average forecast in price units. With `bounds`, each scaled
 * forecast is held inside them first: a linear model extrapolates without
 * limit, and the inverse asinh turns a driver far outside anything seen in
 * training (one mistyped row) into astronomically large prices.
 */
export function linearPrice(
  members: LinearMember[], s: Standardiser, x: Float64Array, m: number, scale: LevelScale,
  bounds?: { lo: Float64Array; hi: Float64Array },
): Float64Array {
  const out = new Float64Array(m);
  for (const member of members) {
    const z = predictRidge(member.weights, s, x, m);
    for (let c = 0; c < m; c++) {
      const held = bounds ? Math.min(bounds.hi[c], Math.max(bounds.lo[c], z[c])) : z[c];
      out[c] += fromScaled(held, scale) / members.length;
    }
  }
  return out;
}

/** Takes new days into a member's sums, drops those that left its window, and re-solves. */
export function advanceMember(member: LinearMember, sums: MemberSums, fresh: TrainingDay[], s: Standardiser): void {
  for (const d of fresh) { addRidgeDay(sums.gram, s, d.x, d.y!); sums.days.push(d); }
  if (member.window > 0) {
    while (sums.days.length > member.window) {
      const old = sums.days.shift()!;
      addRidgeDay(sums.gram, s, old.x, old.y!, -1);
    }
  }
  member.weights = solveRidge(sums.gram, member.lambda);
}
