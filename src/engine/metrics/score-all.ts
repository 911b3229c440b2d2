import { InputError } from '../errors';
import { bias } from './bias';
import { mae } from './mae';
import { mapeGuarded } from './mape-guarded';
import { mase } from './mase';
import { rmae } from './rmae';
import { rmse } from './rmse';
import { smape } from './smape';
import { validRows } from './valid-rows';

export interface ScoreOptions {
  /** Seasonal period of the MASE scale, in periods (e.g. 24 for one day of hours). */
  season: number;
  /** Series that sets the MASE scale; default: `actual` itself (in-file seasonal naive). */
  insample?: readonly number[];
  /** Reference forecast for rMAE, same length as `actual`. */
  reference?: readonly number[];
  /** MAPE guard: pairs with |actual| below this are left out (default 1). */
  minAbsActual?: number;
}

export interface ScoreSet {
  /** Number of periods where actual and forecast are both known. */
  periods: number;
  mae: number;
  rmse: number;
  /** Percent. */
  smape: number;
  /** Percent, guarded; NaN when no actual value passes the guard. */
  mape: number;
  /** Periods left out of MAPE by the guard. */
  mapeSkipped: number;
  /** NaN when the scale is undefined (too short or exactly repeating in-sample series). */
  mase: number;
  /** mean(F - A): positive = forecast too high. */
  bias: number;
  /** Only with `reference`; NaN when the reference has zero error. */
  rmae?: number;
  /** One line per metric that is NaN, saying why (the InputError message). */
  notes: string[];
}

/**
 * All error scores of one forecast column at once, for the `score` command and
 * LOOM.SCORE. Pairs with a NaN are skipped (see each metric). A score that is
 * undefined for this data (MAPE with every actual near zero, MASE with a zero
 * or missing scale, rMAE with an error-free reference) is NaN with a line in
 * `notes`, so that one undefined score does not hide the others; bad input
 * (different lengths, ±Infinity, no complete pair, a bad season) throws.
 *
 * @param actual - observed prices
 * @param forecast - forecast prices, same length as `actual`
 * @param options - `season` (required), `insample`, `reference`, `minAbsActual`
 * @returns a `ScoreSet`
 * @throws {InputError} on bad input as described above
 * @example scoreAll([10, 20, 30, 40], [12, 18, 30, 44], { season: 1 }).mae // 2
 * Source: the definitions cited in each metric's file.
 */
export function scoreAll(
  actual: readonly number[],
  forecast: readonly number[],
  { season, insample = actual, reference, minAbsActual }: ScoreOptions,
): ScoreSet {
  if (!(Number.isInteger(season) && season >= 1)) {
    throw new InputError(`MASE season must be a whole number of periods of at least 1 (got ${season})`);
  }
  const [a] = validRows('scores', ['actual', 'forecast'], [actual, forecast]);
  refuseInfinity('MASE', 'in-sample', insample);
  if (reference !== undefined) {
    if (reference.length !== actual.length) {
      throw new InputError(
        `rMAE requires actual and reference of the same length (got ${actual.length} and ${reference.length})`,
      );
    }
    refuseInfinity('rMAE', 'reference', reference);
  }
  const notes: string[] = [];
  const guarded = orUndefined(() => mapeGuarded(actual, forecast, { minAbsActual }), notes);
  const scores: ScoreSet = {
    periods: a.length,
    mae: mae(actual, forecast),
    rmse: rmse(actual, forecast),
    smape: smape(actual, forecast),
    mape: guarded?.value ?? NaN,
    mapeSkipped: guarded?.skipped ?? a.length,
    mase: orUndefined(() => mase(actual, forecast, insample, season), notes) ?? NaN,
    bias: bias(actual, forecast),
    notes,
  };
  if (reference !== undefined) {
    scores.rmae = orUndefined(() => rmae(actual, forecast, reference), notes) ?? NaN;
  }
  return scores;
}

function refuseInfinity(metric: string, name: string, values: readonly number[]): void {
  const i = values.findIndex((v) => !Number.isNaN(v) && !Number.isFinite(v));
  if (i >= 0) {
    throw new InputError(`${metric}: ${name} value ${i + 1} is ${values[i]}; give a finite number, or NaN for unknown`);
  }
}

function orUndefined<T>(compute: () => T, notes: string[]): T | undefined {
  try {
    return compute();
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    notes.push(error.message);
    return undefined;
  }
}
