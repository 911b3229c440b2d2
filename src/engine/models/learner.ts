import { InputError } from '../errors';
import { historyNeeded } from '../features/day-features';
import { fromScaled, type LevelScale } from '../features/level-scale';
import { frameBefore, targetDay, type DayFrame } from '../series/day-frame';
import { addResiduals, bands, REPORTED_COVERAGES, type Band } from './bands';
import { mix3 } from './blend-weights';
import { LEAR_REFRESH_DAYS, learOnAll, learPoint } from './lear-part';
import { adaptCoverage, missedShare } from './adaptive-coverage';
import { recentWeights, rememberDay, type PartsDay } from './recent-weights';
import { ensemblePrice, fitLearner, MIN_HISTORY_DAYS } from './fit-learner';
import type { LearnerState } from './learner-state';
import { LearnerSettingsSchema, type LearnerSettings } from './learner-settings';
import type { DayAheadModel, DayForecast, Progress } from './model';
import { loadNetwork } from './network';
import { networkSamples, refreshNetworks } from './network-refresh';
import { advanceMember, linearPrice, windowOf, type MemberSums } from './linear-ensemble';
import { checkInputPrices, priceRangeOf, widenRange } from './price-range';
import { ridgeGram } from './ridge';
import { FeatureCache } from './training-days';

export type { BlockScores, LearnerState } from './learner-state';

/**
 * Days between warm starts of the networks when the blend updates: its
 * linear part takes in every new day, the networks (which cost far more)
 * at most weekly. A `neural` model warm-starts at every update it is given.
 */
const NETWORK_REFRESH_DAYS = 7;
/** a driver further than this many training standard deviations from its mean is taken for a typing error */
const MAX_DRIVER_SD = 20;

/**
 * The learned day-ahead model: averaged ridge models and an ensemble of brain.js
 * networks on the same features, blended with a weight chosen on a
 * chronological tuning block (fit-learner.ts). `kind` neural or linear uses
 * one part alone.
 */
export class Learner implements DayAheadModel {
  readonly name: string;
  readonly settings: LearnerSettings;
  state?: LearnerState;
  private cache?: FeatureCache;
  private sums?: MemberSums[];
  private nets: ((x: Float64Array) => Float64Array)[] = [];
  /** forecasts this learner issued, by day index, until their errors join the band pool */
  private readonly issued = new Map<number, Issued>();
  /** the parts' forecasts and actual prices of the newest out-of-sample days (recent-weights.ts) */
  private recent: PartsDay[] = [];
  /** day index of the networks' last warm start (or fit) */
  private lastWarm?: number;
  /** day index of LEAR's last calibration (or fit) */
  private lastLear?: number;

  constructor(settings: LearnerSettings, state?: LearnerState) {
    const checked = LearnerSettingsSchema.safeParse(settings);
    if (!checked.success) throw new InputError(checked.error.issues.map((i) => i.message).join('; '));
    this.settings = checked.data;
    this.name = settings.kind;
    if (state) this.adopt(state);
  }

  get coverage(): number {
    return this.settings.coverage;
  }

  /** From 28 days on; shorter histories shrink the level scale's window and the blocks (choose-setup.ts, blocks.ts). */
  get minHistoryDays(): number {
    return MIN_HISTORY_DAYS;
  }

  /** The linear part takes in every new day; the networks' warm start is rationed (NETWORK_REFRESH_DAYS). */
  get defaultRetrainEvery(): number {
    return this.settings.kind === 'neural' ? NETWORK_REFRESH_DAYS : 1;
  }

  fit(view: DayFrame, progress?: Progress): void {
    const { state, cache, sums, recent } = fitLearner(view, this.settings, progress);
    this.adopt(state, cache, sums);
    this.recent = recent;
    const tuned = { neural: state.neuralWeight, lear: state.learWeight };
    if (this.followRecent()) {
      const pct = (w: number) => `${Math.round(100 * w)} %`;
      state.notes.push(`blend weights ${pct(tuned.neural)} neural, ${pct(tuned.lear)} LEAR from the tuning block moved to ${pct(state.neuralWeight)} neural, ${pct(state.learWeight)} LEAR: they did better on the newest ${recent.length} holdout days (the validation MAE is that of the tuning block's weights)`);
    }
    this.lastWarm = view.price.length;
    this.lastLear = view.price.length;
  }

  predict(view: DayFrame): DayForecast {
    const state = this.fitted();
    const d = targetDay(view);
    const problem = this.inputProblem(view, d);
    if (problem) throw new InputError(problem);
    const f = this.featureCache().features(view, d);
    if (!f) throw new InputError(`cannot forecast ${view.days[d].date}: it needs ${historyNeeded(state.setup)} days of known prices before it`);
    this.catchUpErrors(view, d);
    const parts = this.partsOf(f.x, f.scale, learPoint(state.lear, view));
    const point = this.combine(parts);
    const built = this.bandsAround(point, f.scale.scale);
    const [own, ...reported] = built;
    const { lower, upper } = own;
    // a damaged or hand-edited model, or inputs far outside anything trained on, can overflow sinh
    const infinite = (v: number) => v === Infinity || v === -Infinity;
    if (!point.every(Number.isFinite) || lower.some(infinite) || upper.some(infinite)) {
      throw new InputError(`model ${this.name} gave a forecast for ${view.days[d].date} that is not a finite number; its inputs or the stored model are far out of range`);
    }
    this.issued.set(d, { point, parts, scale: f.scale.scale, bands: built });
    return { point, lower, upper, bands: reported };
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
    state.priceRange = widenRange(state.priceRange, priceRangeOf(view.price.slice(from)));
    state.trainedTo = view.days[view.price.length - 1].date;
    const sinceWarm = this.lastWarm === undefined ? Infinity : view.price.length - this.lastWarm;
    const every = this.settings.kind === 'neural' ? 1 : NETWORK_REFRESH_DAYS;
    if (this.settings.kind !== 'linear' && this.settings.warmEpochs > 0 && sinceWarm >= every) {
      this.lastWarm = view.price.length;
      const samples = networkSamples(cache.trainingDays(view, 0, view.price.length), state.standardiser, state.targetRange);
      state.networks = refreshNetworks(state.networks, samples, this.settings, view.price.length);
      this.nets = state.networks.map(loadNetwork);
      progress?.(1, 1, 'warm start');
    }
    const sinceLear = this.lastLear === undefined ? Infinity : view.price.length - this.lastLear;
    if (state.lear && sinceLear >= LEAR_REFRESH_DAYS) {
      this.lastLear = view.price.length;
      state.lear = learOnAll(view) ?? state.lear;
      progress?.(1, 1, 'lear part');
    }
  }

  /** Why day `d` of `view` cannot be forecast from its inputs, or undefined. */
  private inputProblem(view: DayFrame, d: number): string | undefined {
    const state = this.fitted();
    const date = view.days[d]?.date ?? 'the next day';
    for (const name of state.setup.drivers) {
      if (!view.drivers[name]?.[d] || view.drivers[name][d].some(Number.isNaN)) {
        return `cannot forecast ${date}: driver "${name}" is missing for that day; add its forecast rows`;
      }
      // a mistyped cell (a sentinel, a unit slip) would otherwise give a plausible-looking wrong forecast
      const { mean, sd } = state.setup.driverStats[name];
      const wild = view.drivers[name][d].findIndex((v) => Math.abs(v - mean) > MAX_DRIVER_SD * sd);
      if (wild >= 0) {
        return `cannot forecast ${date}: driver "${name}" is ${view.drivers[name][d][wild]} in slot ${wild + 1}, more than ${MAX_DRIVER_SD} standard deviations from its training mean ${mean.toPrecision(4)}; check that value`;
      }
    }
    try {
      checkInputPrices(view, d - historyNeeded(state.setup), d, state.priceRange, date);
    } catch (err) {
      if (err instanceof InputError) return err.message;
      throw err;
    }
    return undefined;
  }

  /**
   * Errors of forecasts for days before `d` whose prices are now known join
   * the band pool: those this learner issued, and for a stored model given
   * newer history, the newest days after its last recorded error, each
   * forecast from its own past with the model as it stands (no refit), so
   * every error is out-of-sample.
   */
  private catchUpErrors(view: DayFrame, d: number): void {
    const state = this.fitted();
    const from = Math.max(firstDayAfter(view, state.residualsThrough), d - state.residuals.keep);
    for (let k = from; k < d; k++) {
      let issued = this.issued.get(k);
      if (!issued && !this.inputProblem(view, k)) {
        const f = this.featureCache().features(view, k);
        if (f) {
          const parts = this.partsOf(f.x, f.scale, learPoint(state.lear, frameBefore(view, k)));
          issued = { point: this.combine(parts), parts, scale: f.scale.scale };
        }
      }
      if (!issued) continue;
      this.adaptBands(view.price[k], issued);
      addResiduals(state.residuals, view.price[k], issued.point, issued.scale);
      rememberDay(this.recent, { actual: view.price[k], ...issued.parts });
    }
    this.followRecent();
    if (d > 0 && view.days[d - 1].date > state.residualsThrough) state.residualsThrough = view.days[d - 1].date;
    for (const day of this.issued.keys()) if (day < d) this.issued.delete(day);
  }

  /** A blend takes the weights of its parts' recent errors when they beat the current ones (recent-weights.ts); true when it did. */
  private followRecent(): boolean {
    const state = this.fitted();
    if (this.settings.kind !== 'blend') return false;
    const w = recentWeights(this.recent, { neural: state.neuralWeight, lear: state.learWeight });
    if (w) { state.neuralWeight = w.neural; state.learWeight = w.lear; }
    return w !== undefined;
  }

  /** The bands around a point forecast, own coverage first, then REPORTED_COVERAGES, each at its adapted coverage. */
  private bandsAround(point: Float64Array, scale: number) {
    const state = this.fitted();
    return bands(state.residuals, point, scale, this.nominalCoverages(), state.bandCoverage);
  }

  private nominalCoverages(): number[] {
    return [this.settings.coverage, ...REPORTED_COVERAGES];
  }

  /**
   * Adaptive conformal step: each band's coverage moves by how many of the
   * day's prices its band (as it stood) missed; an issued day's bands are
   * those it was given, a caught-up day's are built from the pool as it
   * stands (the same one: nothing joins the pool between a forecast and the
   * catch-up of its day).
   */
  private adaptBands(actual: ArrayLike<number>, issued: Issued): void {
    const state = this.fitted();
    const nominal = this.nominalCoverages();
    const current = state.bandCoverage ?? nominal;
    const built = issued.bands ?? this.bandsAround(issued.point, issued.scale);
    state.bandCoverage = nominal.map((c, i) => adaptCoverage(c, current[i], missedShare(actual, built[i].lower, built[i].upper)));
  }

  /** The feature vector and level scale of day `d` of `view` (undefined when an input is unknown). */
  featuresOf(view: DayFrame, d: number): { x: Float64Array; scale: LevelScale } | undefined {
    return this.featureCache().features(view, d);
  }

  /** LEAR's part of the forecast of the view's target day (undefined without a LEAR part or when its inputs are unknown). */
  learPartOf(view: DayFrame): Float64Array | undefined {
    return learPoint(this.fitted().lear, view);
  }

  /**
   * The point forecast (per clock slot) for a feature vector on a level
   * scale and LEAR's part (learPartOf), without any input checks. Without
   * LEAR's part its weight goes to the linear part.
   */
  forecastFromFeatures(x: Float64Array, scale: LevelScale, lear?: Float64Array): Float64Array {
    return this.combine(this.partsOf(x, scale, lear));
  }

  /** Each part's forecast in price units, held inside the (widened) range of scaled prices seen in training. */
  private partsOf(x: Float64Array, scale: LevelScale, lear: Float64Array | undefined): Parts {
    const state = this.fitted();
    const m = state.targetRange.lo.length;
    const linear = linearPrice(state.linear, state.standardiser, x, m, scale, state.targetRange);
    const neural = this.nets.length ? ensemblePrice(this.nets, state.standardiser, state.targetRange, x, scale) : undefined;
    // LEAR's part is held inside the same range as the others, so the blend never leaves it
    const held = lear?.map((v, c) => Math.min(fromScaled(state.targetRange.hi[c], scale), Math.max(fromScaled(state.targetRange.lo[c], scale), v)));
    return { neural, linear, ...(held ? { lear: held } : {}) };
  }

  private combine(p: Parts): Float64Array {
    const state = this.fitted();
    return mix3(p.neural ? [p.neural] : [], [p.linear], p.lear ? [p.lear] : [], state.neuralWeight, p.lear ? state.learWeight : 0)[0];
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
    this.recent = [];
  }
}

type Parts = Omit<PartsDay, 'actual'>;
interface Issued { point: Float64Array; parts: Parts; scale: number; bands?: Band[] }

/** Index of the first day of `view` after `date`. */
function firstDayAfter(view: DayFrame, date: string): number {
  const i = view.days.findIndex((d) => d.date > date);
  return i < 0 ? view.days.length : i;
}
