import { InputError } from '../errors';
import { historyNeeded } from '../features/day-features';
import { fromScaled } from '../features/level-scale';
import type { DayFrame } from '../series/day-frame';
import { addResiduals, emptyPool } from './bands';
import { bestMix3, meanAbsError, mix3 } from './blend-weights';
import { learBlockForecasts, learOnAll } from './lear-part';
import { trainingBlocks } from './blocks';
import { chooseSetup } from './choose-setup';
import type { BlockScores, LearnerState } from './learner-state';
import type { LearnerSettings } from './learner-settings';
import { chooseLinearMembers, linearPrice, refitLinearMembers, type LinearMember, type MemberSums } from './linear-ensemble';
import type { Progress } from './model';
import { loadNetwork, trainNetwork, type NetworkJson } from './network';
import { networkSamples, refreshNetworks } from './network-refresh';
import { permutationImportance } from './permutation-importance';
import { priceRangeOf } from './price-range';
import { rememberDay, type PartsDay } from './recent-weights';
import { fitStandardiser, standardise, type Standardiser } from './standardiser';
import { FeatureCache, type TrainingDay } from './training-days';
import { fitUnitRange, fromUnit, type UnitRange } from './unit-range';

/** Fewest days of price history a learned model trains on. */
export const MIN_HISTORY_DAYS = 28;
/** Fewest usable training days: 28 days less the 8 the first day's inputs need (scale window 7, week-on-week change). */
export const MIN_TRAINING_DAYS = 20;
const MIN_FIT_DAYS = 10;

/**
 * Fits a learner on every day of `view` (blocks.ts says how the days are
 * cut): the ridge members' penalties by blocked cross-validation over the
 * fit and tuning blocks, the networks' early stopping and the blend weight
 * on the tuning block (for the blend also the weight of LEAR, lear-part.ts,
 * whose forecasts of the tuning and holdout days come from calibrations on
 * earlier days only); the holdout block, which took
 * part in none of those choices, gives the reported error, the permutation
 * importance and the first errors of the bands; then the linear part is
 * refitted on every day and the networks are warm-started on every day.
 */
export function fitLearner(
  view: DayFrame, s: LearnerSettings, progress?: Progress,
): { state: LearnerState; cache: FeatureCache; sums: MemberSums[]; recent: PartsDay[] } {
  if (view.price.length < MIN_HISTORY_DAYS) {
    throw new InputError(`model ${s.kind} needs at least ${MIN_HISTORY_DAYS} days of price history; the data has ${view.price.length}`);
  }
  const { setup, notes } = chooseSetup(view, s);
  const cache = new FeatureCache(setup);
  const days = cache.trainingDays(view, 0, view.price.length);
  if (days.length < MIN_TRAINING_DAYS) {
    throw new InputError(`training needs at least ${MIN_TRAINING_DAYS} usable days with prices after the first ${historyNeeded(setup)} days; found ${days.length}`);
  }
  const blocks = trainingBlocks(days.length, s.validationDays);
  const fit = days.slice(0, blocks.fit);
  const tuning = days.slice(blocks.fit, blocks.fit + blocks.tuning);
  const holdout = days.slice(blocks.fit + blocks.tuning);
  if (fit.length < MIN_FIT_DAYS) {
    throw new InputError(`a tuning block of ${blocks.tuning} days leaves ${fit.length} days to fit on; give a shorter one or more history`);
  }
  const standardiser = fitStandardiser(fit.map((d) => d.x));
  const range = fitUnitRange(fit.map((d) => d.y!));
  const m = view.slots;
  const scorer = (block: TrainingDay[]) => (preds: Float64Array[]) => meanAbsError(block.map((d) => view.price[d.day]), preds);

  // linear part: penalties by blocked cross-validation over fit + tuning (the holdout stays out)
  const beforeHoldout = chooseLinearMembers([...fit, ...tuning], standardiser, m, range, days.length);
  const onFit = refitLinearMembers(beforeHoldout, fit, standardiser).members;
  const linearOn = (members: LinearMember[], block: TrainingDay[]) => block.map((d) => linearPrice(members, standardiser, d.x, m, d.scale, range));
  progress?.(1, 1, 'linear model');

  // neural part: an ensemble of seeds, each early-stopped on the tuning block
  let networks: NetworkJson[] = [];
  if (s.kind !== 'linear') networks = trainEnsemble(fit, tuning, view, s, standardiser, range, progress);
  const runs = networks.map(loadNetwork);
  const neuralOn = (block: TrainingDay[]) => block.map((d) => ensemblePrice(runs, standardiser, range, d.x, d.scale));

  // LEAR part (blend only): forecasts from calibrations on earlier days only, the linear forecast where it has none
  const useLear = s.kind === 'blend';
  const learOn = (block: TrainingDay[], fallback: Float64Array[]) => {
    if (!useLear) return [];
    const got = learBlockForecasts(view, block.map((d) => d.day));
    return got.some((f) => f) ? got.map((f, i) => f ?? fallback[i]) : [];
  };

  const linTuning = linearOn(onFit, tuning);
  const nnTuning = networks.length ? neuralOn(tuning) : [];
  const learTuning = learOn(tuning, linTuning);
  if (useLear) progress?.(1, 1, 'lear part');
  const weights = s.kind === 'neural' ? { wa: 1, wc: 0 } : s.kind === 'linear' ? { wa: 0, wc: 0 }
    : bestMix3(nnTuning, linTuning, learTuning, scorer(tuning), { a: networks.length > 0, c: learTuning.length > 0 });
  const neuralWeight = weights.wa, learWeight = weights.wc;
  const linHoldout = linearOn(beforeHoldout, holdout);
  const nnHoldout = networks.length ? neuralOn(holdout) : [];
  const learHoldout = learWeight > 0 ? learOn(holdout, linHoldout) : [];
  const blended = (nn: Float64Array[], lin: Float64Array[], lear: Float64Array[]) => mix3(nn, lin, lear, neuralWeight, lear.length ? learWeight : 0);
  const scores = (block: TrainingDay[], nn: Float64Array[], lin: Float64Array[], lear: Float64Array[]): BlockScores => ({
    days: block.length,
    mae: scorer(block)(blended(nn, lin, lear)),
    maeLinear: scorer(block)(lin),
    maeNeural: nn.length ? scorer(block)(nn) : NaN,
    maeLear: lear.length ? scorer(block)(lear) : NaN,
    maeNaiveWeek: scorer(block)(block.map((d) => view.price[d.day - 7])),
  });

  const holdoutIndex = new Map(holdout.map((d, i) => [d.day, i]));
  const holdoutForecast = (x: Float64Array, d: TrainingDay) => {
    const lin = linearPrice(beforeHoldout, standardiser, x, m, d.scale, range);
    const nn = runs.length ? [ensemblePrice(runs, standardiser, range, x, d.scale)] : [];
    const lear = learHoldout.length ? [learHoldout[holdoutIndex.get(d.day)!]] : [];
    return blended(nn, [lin], lear)[0];
  };
  const importance = permutationImportance(setup, holdout, s.seed, holdoutForecast, scorer(holdout));
  progress?.(1, 1, 'feature importance');
  const residuals = emptyPool(m, Math.max(blocks.holdout, 91));
  const combined = blended(nnHoldout, linHoldout, learHoldout);
  holdout.forEach((d, i) => addResiduals(residuals, view.price[d.day], combined[i], d.scale.scale));

  // the stored model learns from every day, the holdout included
  const final = refitLinearMembers(beforeHoldout, days, standardiser);
  if (networks.length && s.warmEpochs > 0) {
    networks = refreshNetworks(networks, networkSamples(days, standardiser, range), s, view.price.length);
    progress?.(1, 1, 'warm start');
  }
  const trainedTo = view.days[view.price.length - 1].date;
  const state: LearnerState = {
    setup, notes, standardiser,
    linear: final.members,
    networks, targetRange: range, neuralWeight, learWeight, residuals,
    lear: learWeight > 0 ? learOnAll(view) : undefined,
    tuning: scores(tuning, nnTuning, linTuning, learTuning),
    holdout: scores(holdout, nnHoldout, linHoldout, learHoldout),
    importance,
    priceRange: priceRangeOf(view.price)!,
    trainedFrom: view.days[days[0].day].date,
    trainedTo,
    residualsThrough: trainedTo,
  };
  // the newest holdout days are the first out-of-sample days the rolling weights (recent-weights.ts) learn from
  const recent: PartsDay[] = [];
  holdout.forEach((d, i) => rememberDay(recent, {
    actual: view.price[d.day], linear: linHoldout[i], ...(nnHoldout.length ? { neural: nnHoldout[i] } : {}), ...(learHoldout.length ? { lear: learHoldout[i] } : {}),
  }));
  return { state, cache, sums: final.sums, recent };
}

function trainEnsemble(
  fit: TrainingDay[], tuning: TrainingDay[], view: DayFrame, s: LearnerSettings, standardiser: Standardiser, range: UnitRange, progress?: Progress,
): NetworkJson[] {
  const samples = networkSamples(fit, standardiser, range);
  const inputs = tuning.map((d) => standardise(d.x, standardiser));
  const actual = tuning.map((d) => view.price[d.day]);
  const total = s.network.ensemble * s.network.iterations;
  const networks: NetworkJson[] = [];
  for (let k = 0; k < s.network.ensemble; k++) {
    const loss = (run: (x: Float64Array) => Float64Array) =>
      meanAbsError(actual, tuning.map((d, i) => fromUnit(run(inputs[i]), range).map((z) => fromScaled(z, d.scale))));
    const { json } = trainNetwork(samples, s.network, s.seed * 101 + k, loss, (epoch, value) => progress?.(k * s.network.iterations + epoch, total, 'network epochs', value));
    networks.push(json);
  }
  return networks;
}

/** The ensemble's mean forecast in price units. */
export function ensemblePrice(
  runs: ((x: Float64Array) => Float64Array)[], standardiser: Standardiser, range: UnitRange, x: Float64Array, scale: { centre: number; scale: number },
): Float64Array {
  const m = range.lo.length;
  const input = standardise(x, standardiser);
  const sum = new Float64Array(m);
  for (const run of runs) {
    const z = fromUnit(run(input), range);
    for (let c = 0; c < m; c++) sum[c] += z[c];
  }
  return sum.map((z) => fromScaled(z / runs.length, scale));
}
