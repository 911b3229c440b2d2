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

/**
 * Chooses each member's penalty on `tuning` after fitting on `fit`. A window
 * at least as long as `fit` is the expanding one again and is left out.
 * @returns the members as fitted on `fit`, for forecasts of the tuning block
 */
export function chooseLinearMembers(
  fit: TrainingDay[], tuning: TrainingDay[], s: Standardiser, m: number, bounds: UnitRange,
  score: (preds: Float64Array[]) => number,
): LinearMember[] {
  const chosen: LinearMember[] = [];
  for (const window of LINEAR_WINDOWS) {
    if (window > 0 && window >= fit.length) continue;
    const part = windowOf(fit, window);
    const gram = ridgeGram(part.map((d) => d.x), part.map((d) => d.y!), s);
    let best: LinearMember | undefined, bestScore = Infinity;
    for (const lambda of RIDGE_LAMBDAS) {
      const weights = solveRidge(gram, lambda);
      const e = score(tuning.map((d) => linearPrice([{ window, lambda, weights }], s, d.x, m, d.scale, bounds)));
      if (e < bestScore) { bestScore = e; best = { window, lambda, weights }; }
    }
    chosen.push(best!);
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
