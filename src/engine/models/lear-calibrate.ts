import { isoWeekday } from '../calendar/weekday';
import { InputError } from '../errors';
import { lassoCriterion } from '../linalg/lars-criterion';
import { larsLassoPath } from '../linalg/lars-lasso';
import { olsNoiseVariance } from '../linalg/lars-noise-variance';
import type { DayFrame } from '../series/day-frame';
import { DAYS_PER_INPUT, inputValue, LEAR_LEVELS, learDesign, publishedInputCount, widestPeriod, type LearDesign, type LearLevel } from './lear-features';
import { fromAsinh, robustScale, toAsinh, type RobustScale } from './lear-scale';
import type { DayForecast, Progress } from './model';

/**
 * LEAR, the LASSO-estimated auto-regressive benchmark of Lago, Marcjasz,
 * De Schutter & Weron (2021), Applied Energy 293, 116983, as a pure
 * calibrate / predict pair on a view (frameBefore).
 *
 * As published (recalled from memory, with the public code beside the paper,
 * epftoolbox `_lear.py`, read for the details): one linear model per period
 * of the day; every input column and every period's price over the
 * calibration window asinh-transformed around its median with MAD spread
 * (lear-scale.ts; the weekday dummies as they are); the penalty of each
 * period's lasso chosen by LARS with the Akaike criterion (scikit-learn's
 * `LassoLarsIC(criterion='aic', max_iter=2500)`), the model at that penalty
 * refitted (there with coordinate-descent `Lasso(alpha)`; here the LARS
 * knot itself, the same optimum); recalibrated every day on a rolling
 * window (the paper reports windows of 56, 84, 1092 and 1456 days and their
 * average, from memory; 728 by default here, or all the history there is).
 * Inputs: lear-features.ts.
 *
 * As scikit-learn 1.2 (Debian's, the reference of the tests): no column
 * normalisation inside the criterion and the noise variance from least
 * squares on all inputs (lars-noise-variance.ts). The published results
 * predate scikit-learn 1.1 and 1.2; until then `LassoLarsIC` normalised the
 * columns by default (normalize=True, which the coordinate-descent refit
 * did not) and scored n·MSE / var(y) + 2·df, i.e. took var(y) as the noise
 * variance (lassoCriterion with noiseVariance = var(y) reproduces that).
 *
 * Our choices: the reduced input sets of lear-features.ts where the days
 * cannot support the published one (noted in `note`); days whose inputs or
 * target are unknown are left out of the window; no band (lower and upper
 * stay undefined: the literature's LEAR is a point forecast).
 *
 * @example
 *   const cal = calibrateLear(frameBefore(frame, d));
 *   const { point } = predictLear(cal, frameBefore(frame, d));
 */
export interface LearSettings {
  /** calibration window in days of price history (fewer when the history is shorter) */
  windowDays: number;
  criterion: 'aic' | 'bic';
  /** LARS steps per period at most (max_iter of the published code) */
  maxSteps: number;
  /** force an input level instead of choosing by the days available */
  level?: LearLevel;
}

export const DEFAULT_LEAR_SETTINGS: LearSettings = { windowDays: 728, criterion: 'aic', maxSteps: 2500 };

/** Fewest days of price history LEAR calibrates on. */
export const LEAR_MIN_HISTORY_DAYS = 28;

export interface LearPeriod {
  /** indices into design.inputs */
  inputs: number[];
  /** coefficients on the centred asinh scale, one per input */
  coef: Float64Array;
  /** intercept on the asinh scale: mean target minus Σ coef × mean input */
  intercept: number;
  /** the chosen penalty (scikit-learn's alpha) */
  alpha: number;
  /** inputs with a non-zero coefficient */
  selected: number;
  target: RobustScale;
}

export interface LearCalibration {
  design: LearDesign;
  drivers: string[];
  /** the scale of each design input over the window (identity for dummies) */
  inputScales: RobustScale[];
  periods: LearPeriod[];
  /** days used: calibration targets */
  days: number;
  /** first and last calibration target date */
  from: string;
  to: string;
  /** why a reduced input set was used, when it was */
  note?: string;
}

export function calibrateLear(view: DayFrame, settings: LearSettings = DEFAULT_LEAR_SETTINGS, progress?: Progress): LearCalibration {
  const D = view.price.length;
  if (D < LEAR_MIN_HISTORY_DAYS) {
    throw new InputError(`lear needs at least ${LEAR_MIN_HISTORY_DAYS} days of price history before the forecast day; the data has ${D}`);
  }
  const drivers = Object.keys(view.drivers);
  const window = Math.min(settings.windowDays, D);
  const weekdayOf = weekdays(view);
  const choice = chooseLevel(view, drivers, D - window, D, settings.level);
  const { design, days } = choice;
  const n = days.length;
  const S = view.slots;

  // scaled, centred input columns
  const U = design.inputs.length;
  const columns: Float64Array[] = [];
  const means = new Float64Array(U);
  const inputScales: RobustScale[] = [];
  for (let u = 0; u < U; u++) {
    const input = design.inputs[u];
    const raw = new Float64Array(n);
    for (let i = 0; i < n; i++) raw[i] = inputValue(view, input, days[i], weekdayOf);
    const scale = input.weekday ? { centre: 0, scale: 1 } : robustScale(raw);
    inputScales.push(scale);
    if (!input.weekday) for (let i = 0; i < n; i++) raw[i] = toAsinh(raw[i], scale);
    let mean = 0;
    for (let i = 0; i < n; i++) mean += raw[i];
    mean /= n;
    for (let i = 0; i < n; i++) raw[i] -= mean;
    means[u] = mean;
    columns.push(raw);
  }
  const gram = new LazyGram(columns);

  // scaled, centred targets per period
  const targets: Float64Array[] = [], targetScales: RobustScale[] = [], targetMeans = new Float64Array(S);
  for (let h = 0; h < S; h++) {
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) y[i] = view.price[days[i]][h];
    const scale = robustScale(y);
    let mean = 0;
    for (let i = 0; i < n; i++) { y[i] = toAsinh(y[i], scale); mean += y[i]; }
    mean /= n;
    for (let i = 0; i < n; i++) y[i] -= mean;
    targets.push(y); targetScales.push(scale); targetMeans[h] = mean;
  }

  const shared = design.level === 'published';
  const sharedGram = shared ? gram.block(design.byPeriod[0]) : undefined;
  const sharedNoise = shared ? noiseVariances(sharedGram!, design.byPeriod[0], columns, targets, n) : undefined;
  const periods: LearPeriod[] = [];
  for (let h = 0; h < S; h++) {
    const inputs = design.byPeriod[h];
    const p = inputs.length;
    const g = sharedGram ?? gram.block(inputs);
    const xty = crossWith(columns, inputs, targets[h]);
    const yty = dot(targets[h], targets[h]);
    const sigma2 = sharedNoise ? sharedNoise[h] : noiseVariances(g, inputs, columns, [targets[h]], n)[0];
    const path = larsLassoPath(g, xty, p, n, { maxSteps: settings.maxSteps });
    const pick = lassoCriterion(path, xty, yty, p, n, sigma2, settings.criterion);
    let intercept = targetMeans[h];
    let selected = 0;
    for (let k = 0; k < p; k++) {
      intercept -= pick.coef[k] * means[inputs[k]];
      if (pick.coef[k] !== 0) selected++;
    }
    periods.push({ inputs, coef: Float64Array.from(pick.coef), intercept, alpha: pick.alpha, selected, target: targetScales[h] });
    progress?.(h + 1, S, 'lear periods');
  }
  return {
    design, drivers, inputScales, periods, days: n,
    from: view.days[days[0]].date, to: view.days[days[n - 1]].date, note: choice.note,
  };
}

/** LEAR's forecast of the view's target day from a calibration (on an earlier or the same view). */
export function predictLear(cal: LearCalibration, view: DayFrame): DayForecast {
  return { point: learFromInputs(cal, learInputs(cal, view), view.days[view.price.length].date) };
}

/** The raw value of each design input of a calibration for the view's target day (what predictLear reads). */
export function learInputs(cal: LearCalibration, view: DayFrame): Float64Array {
  const D = view.price.length;
  const date = view.days[D]?.date;
  if (date === undefined) throw new InputError('lear: the data holds no day after the last price to forecast');
  for (const d of cal.drivers) {
    if (!view.drivers[d]) throw new InputError(`lear was calibrated with driver "${d}", which the data for ${date} lacks`);
  }
  const weekdayOf = weekdays(view);
  return Float64Array.from(cal.design.inputs, (input) => {
    const x = inputValue(view, input, D, weekdayOf);
    if (!Number.isFinite(x)) {
      throw new InputError(`lear needs ${input.source} of ${view.days[D - input.lag]?.date ?? `${input.lag} days before ${date}`} to forecast ${date}, and it is unknown`);
    }
    return x;
  });
}

/** LEAR's point forecast from raw input values (learInputs), per period; `date` names the day in messages. */
export function learFromInputs(cal: LearCalibration, values: Float64Array, date = 'the day'): Float64Array {
  const z = cal.design.inputs.map((input, u) => (input.weekday ? values[u] : toAsinh(values[u], cal.inputScales[u])));
  const point = new Float64Array(cal.periods.length);
  cal.periods.forEach((period, h) => {
    let y = period.intercept;
    for (let k = 0; k < period.inputs.length; k++) if (period.coef[k] !== 0) y += period.coef[k] * z[period.inputs[k]];
    point[h] = fromAsinh(y, period.target);
    if (!Number.isFinite(point[h])) throw new InputError(`lear gave no finite forecast for ${date}, slot ${h + 1}: an input lies far outside the calibration window`);
  });
  return point;
}

/** The forecast for a view's target day, calibrated on that view: the pure one-call form. */
export function learForecast(view: DayFrame, settings: LearSettings = DEFAULT_LEAR_SETTINGS): DayForecast {
  return predictLear(calibrateLear(view, settings), view);
}

function chooseLevel(view: DayFrame, drivers: string[], first: number, end: number, forced?: LearLevel) {
  const levels = forced ? [forced] : LEAR_LEVELS;
  let fallback = '';
  for (const level of levels) {
    if (level === 'hourly-profile' && view.slots === 24 && !forced) continue; // the same as published at hourly resolution
    const design = learDesign(level, view.slots, drivers);
    const days = usableDays(view, design, first + design.maxLag, end);
    const p = widestPeriod(design);
    if (forced ? days.length > p + 1 : p * DAYS_PER_INPUT <= days.length) {
      const note = level === 'published' ? undefined
        : `lear: ${days.length} calibration days cannot support the published ${publishedInputCount(view.slots, drivers.length)} inputs per period; using the "${level}" set (${p} inputs per period)`;
      return { design, days, note: forced ? undefined : note };
    }
    fallback = `${p} inputs need ${forced ? p + 2 : p * DAYS_PER_INPUT} usable days, the window has ${days.length}`;
  }
  throw new InputError(`lear cannot calibrate: even its smallest input set (${fallback}); give more history or fewer driver columns`);
}

/** Days t in [from, end) whose target row and every row an input reads are fully known. */
function usableDays(view: DayFrame, design: LearDesign, from: number, end: number): number[] {
  const needs = new Map<string, Set<number>>();
  for (const input of design.inputs) {
    if (input.weekday) continue;
    if (!needs.has(input.source)) needs.set(input.source, new Set());
    needs.get(input.source)!.add(input.lag);
  }
  const known = (rows: Float64Array[] | undefined, r: number) => {
    const row = rows?.[r];
    if (!row) return false;
    for (const v of row) if (!Number.isFinite(v)) return false;
    return true;
  };
  const out: number[] = [];
  for (let t = from; t < end; t++) {
    if (!known(view.price, t)) continue;
    let ok = true;
    for (const [source, lags] of needs) {
      const rows = source === 'price' ? view.price : view.drivers[source];
      for (const lag of lags) if (!known(rows, t - lag)) { ok = false; break; }
      if (!ok) break;
    }
    if (ok) out.push(t);
  }
  return out;
}

function weekdays(view: DayFrame): (t: number) => number {
  return (t) => isoWeekday(view.days[t].date);
}

/** Gram entries of the design columns, each computed once when first needed. */
class LazyGram {
  private readonly values: Float64Array;
  private readonly done: Uint8Array;
  private readonly u: number;

  constructor(private readonly columns: Float64Array[]) {
    this.u = columns.length;
    this.values = new Float64Array(this.u * this.u);
    this.done = new Uint8Array(this.u * this.u);
  }

  /** XᵀX of the listed columns (p × p, row-major). */
  block(list: number[]): Float64Array {
    const p = list.length, u = this.u;
    const g = new Float64Array(p * p);
    for (let a = 0; a < p; a++) {
      for (let b = 0; b <= a; b++) {
        const i = list[a], j = list[b];
        const k = i < j ? i * u + j : j * u + i;
        if (!this.done[k]) { this.values[k] = dot(this.columns[i], this.columns[j]); this.done[k] = 1; }
        g[a * p + b] = g[b * p + a] = this.values[k];
      }
    }
    return g;
  }
}

function crossWith(columns: Float64Array[], list: number[], y: Float64Array): Float64Array {
  return Float64Array.from(list, (i) => dot(columns[i], y));
}

function noiseVariances(g: Float64Array, list: number[], columns: Float64Array[], targets: Float64Array[], n: number): Float64Array {
  const ytys = targets.map((y) => dot(y, y));
  const sigma2 = olsNoiseVariance(g, targets.map((y) => crossWith(columns, list, y)), ytys, list.length, n);
  if (!sigma2) throw new InputError(`lear: ${n} calibration days are too few for ${list.length} inputs`);
  // an exact fit would leave σ² = 0 and the criterion undefined: keep a floor far below any real noise
  return sigma2.map((s, m) => Math.max(s, 1e-12 * ytys[m] / n, 1e-300));
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
