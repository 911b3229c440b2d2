import { InputError } from '../errors';
import seedrandom from 'seedrandom';
import { featureLayout, historyNeeded, type FeatureSetup } from '../features/day-features';
import type { FeatureGroup } from '../features/feature-groups';
import { fromScaled } from '../features/level-scale';
import { targetDay, type DayFrame } from '../series/day-frame';
import { addResiduals, band, emptyPool, type ResidualPool } from './bands';
import { LearnerSettingsSchema, type LearnerSettings } from './learner-settings';
import type { DayAheadModel, DayForecast, Progress } from './model';
import { loadNetwork, trainNetwork, type NetworkJson } from './network';
import { advanceMember, fitLinearEnsemble, linearPrice, windowOf, type LinearMember, type MemberSums } from './linear-ensemble';
import { ridgeGram } from './ridge';
import { fitStandardiser, standardise, type Standardiser } from './standardiser';
import { FeatureCache, type TrainingDay } from './training-days';
import { fitUnitRange, fromUnit, toUnit, type UnitRange } from './unit-range';

/** What a fitted learner knows; model-file.ts stores exactly this. */
export interface LearnerState {
  setup: FeatureSetup;
  notes: string[];
  standardiser: Standardiser;
  /** ridge models on several calibration windows (linear-ensemble.ts) */
  linear: LinearMember[];
  networks: NetworkJson[];
  /** map of the networks' targets into the sigmoid's (0, 1) (unit-range.ts) */
  targetRange: UnitRange;
  /** weight of the network ensemble in the blend (1 = neural only, 0 = linear only) */
  neuralWeight: number;
  residuals: ResidualPool;
  validation: { days: number; mae: number; maeLinear: number; maeNeural: number; maeNaiveWeek: number };
  /** mean increase of validation MAE when a group's inputs are shuffled */
  importance: { group: FeatureGroup; increase: number }[];
  trainedFrom: string;
  /** last delivery day whose prices the model has learned from */
  trainedTo: string;
}

const MIN_TRAINING_DAYS = 56;
/** days between warm starts of the networks during updates (they cost far more than the linear part) */
const NETWORK_REFRESH_DAYS = 7;
/** a driver further than this many training standard deviations from its mean is taken for a typing error */
const MAX_DRIVER_SD = 20;

/**
 * The learned day-ahead model: averaged ridge models and an ensemble of brain.js
 * networks on the same features, blended with a weight chosen on a
 * chronological validation block at the end of the training span.
 * `kind` neural or linear uses one part alone.
 */
export class Learner implements DayAheadModel {
  readonly name: string;
  readonly settings: LearnerSettings;
  state?: LearnerState;
  private cache?: FeatureCache;
  private sums?: MemberSums[];
  private nets: ((x: Float64Array) => Float64Array)[] = [];
  private readonly issued = new Map<number, { point: Float64Array; scale: number }>();
  /** day index of the networks' last warm start (or fit) */
  private lastWarm?: number;

  constructor(settings: LearnerSettings, state?: LearnerState) {
    const checked = LearnerSettingsSchema.safeParse(settings);
    if (!checked.success) throw new InputError(checked.error.issues.map((i) => i.message).join('; '));
    this.settings = checked.data;
    this.name = settings.kind;
    if (state) this.adopt(state);
  }

  get minHistoryDays(): number {
    return MIN_TRAINING_DAYS + this.settings.scaleWindow;
  }

  /** The linear part takes in every new day; the networks' warm start is rationed (NETWORK_REFRESH_DAYS). */
  get defaultRetrainEvery(): number {
    return this.settings.kind === 'neural' ? NETWORK_REFRESH_DAYS : 1;
  }

  fit(view: DayFrame, progress?: Progress): void {
    const s = this.settings;
    const { setup, notes } = chooseSetup(view, s);
    const cache = new FeatureCache(setup);
    const days = cache.trainingDays(view, 0, view.price.length);
    if (days.length < MIN_TRAINING_DAYS) {
      throw new InputError(`training needs at least ${MIN_TRAINING_DAYS} usable days with prices after the first ${historyNeeded(setup)} days; found ${days.length}`);
    }
    const vDays = s.validationDays || Math.min(91, Math.max(21, Math.round(days.length * 0.2)));
    const train = days.slice(0, days.length - vDays);
    const val = days.slice(days.length - vDays);
    const standardiser = fitStandardiser(train.map((d) => d.x));
    const m = view.slots;
    const actual = (d: TrainingDay) => view.price[d.day];
    const priceOf = (d: TrainingDay, z: Float64Array) => z.map((v) => fromScaled(v, d.scale));
    const maeOn = (preds: Float64Array[]) => meanAbs(val.map(actual), preds);

    // linear part: penalty chosen on the validation block
    const linear = fitLinearEnsemble(train, val, days, standardiser, m, maeOn);
    const linVal = val.map((d) => linearPrice(linear.trainOnly, standardiser, d.x, m, d.scale));
    progress?.(1, 1, 'linear model');

    // neural part: an ensemble of seeds, early-stopped on validation MAE
    const range = fitUnitRange(train.map((d) => d.y!));
    const samples = train.map((d) => ({ input: standardise(d.x, standardiser), output: toUnit(d.y!, range) }));
    const networkScaled = (run: (x: Float64Array) => Float64Array, input: Float64Array) => fromUnit(run(input), range);
    const valInputs = val.map((d) => standardise(d.x, standardiser));
    const networks: NetworkJson[] = [];
    const valNets: ((x: Float64Array) => Float64Array)[] = [];
    let nnVal: Float64Array[] = [];
    if (s.kind !== 'linear') {
      const sums = val.map(() => new Float64Array(m));
      const total = s.network.ensemble * s.network.iterations;
      for (let k = 0; k < s.network.ensemble; k++) {
        const loss = (run: (x: Float64Array) => Float64Array) => maeOn(val.map((d, i) => priceOf(d, networkScaled(run, valInputs[i]))));
        const { json } = trainNetwork(samples, s.network, s.seed * 101 + k, loss, (epoch, loss) => progress?.(k * s.network.iterations + epoch, total, 'network epochs', loss));
        networks.push(json);
        const run = loadNetwork(json);
        valNets.push(run);
        val.forEach((d, i) => { const z = networkScaled(run, valInputs[i]); for (let c = 0; c < m; c++) sums[i][c] += z[c]; });
      }
      nnVal = val.map((d, i) => priceOf(d, sums[i].map((v) => v / s.network.ensemble)));
    }

    // blend weight on the validation block
    let neuralWeight = s.kind === 'neural' ? 1 : 0;
    if (s.kind === 'blend') {
      let bestBlend = Infinity;
      for (let w = 0; w <= 1.0001; w += 0.05) {
        const e = maeOn(mix(nnVal, linVal, w));
        if (e < bestBlend - 1e-12) { bestBlend = e; neuralWeight = Math.round(w * 100) / 100; }
      }
    }
    const combined = s.kind === 'linear' ? linVal : mix(nnVal, linVal, neuralWeight);
    const importance = permutationImportance(setup, val, maeOn(combined), s.seed, (x, d) => {
      const lin = linearPrice(linear.trainOnly, standardiser, x, m, d.scale);
      if (networks.length === 0 || neuralWeight === 0) return lin;
      const input = standardise(x, standardiser);
      const sum = new Float64Array(m);
      for (const run of valNets) { const z = networkScaled(run, input); for (let c = 0; c < m; c++) sum[c] += z[c]; }
      return mix([priceOf(d, sum.map((v) => v / valNets.length))], [lin], neuralWeight)[0];
    }, (preds) => maeOn(preds));
    progress?.(1, 1, 'feature importance');
    const residuals = emptyPool(m, Math.max(vDays, 91));
    val.forEach((d, i) => addResiduals(residuals, actual(d), combined[i], d.scale.scale));

    const state: LearnerState = {
      setup, notes, standardiser,
      linear: linear.members,
      networks, targetRange: range, neuralWeight, residuals,
      validation: {
        days: vDays, mae: maeOn(combined), maeLinear: maeOn(linVal), maeNeural: nnVal.length ? maeOn(nnVal) : NaN,
        maeNaiveWeek: maeOn(val.map((d) => view.price[d.day - 7])),
      },
      importance,
      trainedFrom: view.days[days[0].day].date,
      trainedTo: view.days[view.price.length - 1].date,
    };
    this.adopt(state, cache, linear.sums);
    this.lastWarm = view.price.length;
  }

  predict(view: DayFrame): DayForecast {
    const state = this.fitted();
    const d = targetDay(view);
    for (const name of state.setup.drivers) {
      if (!view.drivers[name]?.[d] || view.drivers[name][d].some(Number.isNaN)) {
        throw new InputError(`cannot forecast ${view.days[d]?.date ?? 'the next day'}: driver "${name}" is missing for that day; add its forecast rows`);
      }
      // a mistyped cell (a sentinel, a unit slip) would otherwise give a plausible-looking wrong forecast
      const { mean, sd } = state.setup.driverStats[name];
      const wild = view.drivers[name][d].findIndex((v) => Math.abs(v - mean) > MAX_DRIVER_SD * sd);
      if (wild >= 0) {
        throw new InputError(
          `cannot forecast ${view.days[d].date}: driver "${name}" is ${view.drivers[name][d][wild]} in slot ${wild + 1}, more than ${MAX_DRIVER_SD} standard deviations from its training mean ${mean.toPrecision(4)}; check that value`,
        );
      }
    }
    const f = this.featureCache().features(view, d);
    if (!f) throw new InputError(`cannot forecast ${view.days[d].date}: it needs ${historyNeeded(state.setup)} days of known prices before it`);
    const point = this.pointForecast(f.x, f.scale);
    const { lower, upper } = band(state.residuals, point, f.scale.scale, this.settings.coverage);
    // a damaged or hand-edited model, or inputs far outside anything trained on, can overflow sinh
    const infinite = (v: number) => v === Infinity || v === -Infinity;
    if (!point.every(Number.isFinite) || lower.some(infinite) || upper.some(infinite)) {
      throw new InputError(`model ${this.name} gave a forecast for ${view.days[d].date} that is not a finite number; its inputs or the stored model are far out of range`);
    }
    this.recordIssued(view, d, point, f.scale.scale);
    return { point, lower, upper };
  }

  /** Takes in the days that became known since the last fit or update. */
  update(view: DayFrame, progress?: Progress): void {
    const state = this.fitted();
    const cache = this.featureCache();
    const from = firstDayAfter(view, state.trainedTo);
    if (from >= view.price.length) return;
    const fresh = cache.trainingDays(view, from, view.price.length);
    const sums = this.linearSums(view, from);
    state.linear.forEach((member, k) => advanceMember(member, sums[k], fresh, state.standardiser));
    state.trainedTo = view.days[view.price.length - 1].date;
    const sinceWarm = this.lastWarm === undefined ? Infinity : view.price.length - this.lastWarm;
    if (this.settings.kind !== 'linear' && this.settings.warmEpochs > 0 && sinceWarm >= NETWORK_REFRESH_DAYS) {
      this.lastWarm = view.price.length;
      const all = cache.trainingDays(view, 0, view.price.length);
      const samples = all.map((d) => ({ input: standardise(d.x, state.standardiser), output: toUnit(d.y!, state.targetRange) }));
      const warm = { ...this.settings.network, iterations: this.settings.warmEpochs, checkEvery: this.settings.warmEpochs, patience: 1 };
      state.networks = state.networks.map((json, k) =>
        trainNetwork(samples, warm, this.settings.seed * 101 + k + view.price.length * 7919, () => 0, undefined, json).json);
      this.nets = state.networks.map(loadNetwork);
      progress?.(1, 1, 'warm start');
    }
  }

  private pointForecast(x: Float64Array, scale: { centre: number; scale: number }): Float64Array {
    const state = this.fitted();
    const m = state.targetRange.lo.length;
    // held inside the (widened) range of scaled prices seen in training
    const lin = linearPrice(state.linear, state.standardiser, x, m, scale, state.targetRange);
    if (this.nets.length === 0) return lin;
    const input = standardise(x, state.standardiser);
    const sum = new Float64Array(m);
    for (const run of this.nets) {
      const z = fromUnit(run(input), state.targetRange);
      for (let c = 0; c < m; c++) sum[c] += z[c];
    }
    const nn = sum.map((z) => fromScaled(z / this.nets.length, scale));
    return mix([nn], [lin], state.neuralWeight)[0];
  }

  /** Errors of earlier forecasts whose prices are now known join the band pool. */
  private recordIssued(view: DayFrame, d: number, point: Float64Array, scale: number): void {
    const state = this.fitted();
    for (const [day, f] of this.issued) {
      if (day < view.price.length) {
        addResiduals(state.residuals, view.price[day], f.point, f.scale);
        this.issued.delete(day);
      }
    }
    this.issued.set(d, { point, scale });
  }

  /** The linear model's running sums; after loading a stored model they are rebuilt from the history. */
  private linearSums(view: DayFrame, upTo: number): MemberSums[] {
    if (this.sums) return this.sums;
    const state = this.fitted();
    const all = this.featureCache().trainingDays(view, 0, upTo);
    this.sums = state.linear.map((member) => {
      const days = windowOf(all, member.window);
      return { gram: ridgeGram(days.map((d) => d.x), days.map((d) => d.y!), state.standardiser), days: [...days] };
    });
    return this.sums;
  }

  private featureCache(): FeatureCache {
    this.cache ??= new FeatureCache(this.fitted().setup);
    return this.cache;
  }

  private fitted(): LearnerState {
    if (!this.state) throw new InputError(`model ${this.name} has not been trained yet`);
    return this.state;
  }

  private adopt(state: LearnerState, cache?: FeatureCache, sums?: MemberSums[]): void {
    this.state = state;
    this.cache = cache;
    this.sums = sums;
    this.nets = this.settings.kind === 'linear' ? [] : state.networks.map(loadNetwork);
    this.issued.clear();
  }
}

/** Index of the first day of `view` after `date`. */
function firstDayAfter(view: DayFrame, date: string): number {
  const i = view.days.findIndex((d) => d.date > date);
  return i < 0 ? view.days.length : i;
}

/**
 * Permutation importance (Breiman 2001; Fisher, Rudin & Dominici 2019):
 * each group's columns are shuffled together across the validation days
 * and the rise in MAE is recorded. Seeded, so it repeats exactly.
 */
function permutationImportance(
  setup: FeatureSetup, val: TrainingDay[], baseMae: number, seed: number,
  predict: (x: Float64Array, d: TrainingDay) => Float64Array, score: (preds: Float64Array[]) => number,
): { group: FeatureGroup; increase: number }[] {
  const rng = seedrandom(`spotloom-importance-${seed}`);
  const out: { group: FeatureGroup; increase: number }[] = [];
  let start = 0;
  for (const { group, names } of featureLayout(setup)) {
    const cols = names.length;
    const order = val.map((_, i) => i);
    for (let i = order.length - 1; i > 0; i--) { const j = Math.floor(rng() * (i + 1)); [order[i], order[j]] = [order[j], order[i]]; }
    const preds = val.map((d, i) => {
      const x = Float64Array.from(d.x);
      x.set(val[order[i]].x.subarray(start, start + cols), start);
      return predict(x, d);
    });
    out.push({ group, increase: score(preds) - baseMae });
    start += cols;
  }
  return out.sort((a, b) => b.increase - a.increase);
}

function chooseSetup(view: DayFrame, s: LearnerSettings): { setup: FeatureSetup; notes: string[] } {
  const notes: string[] = [];
  const drivers = Object.keys(view.drivers);
  let groups: FeatureGroup[] = [...s.groups];
  const drop = (g: FeatureGroup, why: string) => {
    if (groups.includes(g)) { groups = groups.filter((x) => x !== g); notes.push(`${g} left out: ${why}`); }
  };
  if (view.price.length < 364 + 365) drop('price_year_ago', 'less than two years of history');
  if (!s.region) drop('holidays', 'no holiday region given');
  if (drivers.length === 0) { drop('drivers_target', 'no driver columns'); drop('drivers_lagged', 'no driver columns'); drop('residual_load', 'no driver columns'); }
  if (groups.length === 0) throw new InputError('no feature group is left to train on; switch on price lags or add driver columns');
  const driverStats: FeatureSetup['driverStats'] = {};
  for (const name of drivers) {
    const values = view.drivers[name].slice(0, view.price.length).flatMap((r) => Array.from(r)).filter(Number.isFinite);
    if (values.length === 0) throw new InputError(`driver "${name}" has no known value in the training span`);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / values.length) || 1;
    driverStats[name] = { mean, sd };
  }
  return { setup: { groups, drivers, driverStats, region: s.region, scaleWindow: s.scaleWindow, slots: view.slots }, notes };
}

function mix(a: Float64Array[], b: Float64Array[], wa: number): Float64Array[] {
  if (wa === 0 || a.length === 0) return b;
  if (wa === 1) return a;
  return a.map((row, i) => row.map((v, k) => wa * v + (1 - wa) * b[i][k]));
}

function meanAbs(actual: Float64Array[], forecast: Float64Array[]): number {
  let sum = 0, n = 0;
  actual.forEach((row, i) => row.forEach((v, k) => { const e = Math.abs(v - forecast[i][k]); if (Number.isFinite(e)) { sum += e; n++; } }));
  return n ? sum / n : NaN;
}
