import { mae } from '../metrics/mae';
import { pinball } from '../metrics/pinball';
import { rmse } from '../metrics/rmse';
import { smape } from '../metrics/smape';
import type { BacktestRow } from './run-backtest';

/** How one band level did: the share of actual prices inside it and its pinball loss. */
export interface BandScore {
  nominal: number;
  /** share of actual prices inside [lower, upper] */
  coverage: number;
  /** mean pinball loss of its two edges as quantile forecasts at (1 − c)/2 and (1 + c)/2 */
  pinball: number;
  periods: number;
}

export interface BacktestSummary {
  model: string;
  mae: number;
  rmse: number;
  smape: number;
  /** MAE over the naive-week MAE on the same periods */
  rmae: number;
  periods: number;
  days: number;
  seconds: number;
  /** share of actual prices inside [lower, upper], when the model gives bands */
  coverage?: number;
  /** the coverage the model's band aims at */
  nominalCoverage?: number;
  /** every reported band level (models/bands.ts REPORTED_COVERAGES), when the model gives them */
  bands?: BandScore[];
}

/** Scores the rows that have both a forecast and an actual price. */
export function summarise(model: string, rows: BacktestRow[], seconds: number, nominalCoverage?: number, levels?: number[]): BacktestSummary {
  const scored = rows.filter((r) => Number.isFinite(r.forecast) && Number.isFinite(r.actual));
  const actual = scored.map((r) => r.actual);
  const forecast = scored.map((r) => r.forecast);
  const both = scored.filter((r) => Number.isFinite(r.naiveWeek));
  const rmae = both.length
    ? mae(both.map((r) => r.actual), both.map((r) => r.forecast)) / mae(both.map((r) => r.actual), both.map((r) => r.naiveWeek))
    : NaN;
  const banded = scored.filter((r) => Number.isFinite(r.lower) && Number.isFinite(r.upper));
  const summary: BacktestSummary = {
    model,
    mae: scored.length ? mae(actual, forecast) : NaN,
    rmse: scored.length ? rmse(actual, forecast) : NaN,
    smape: scored.length ? smape(actual, forecast) : NaN,
    rmae,
    periods: rows.length,
    days: new Set(rows.map((r) => r.day)).size,
    seconds,
  };
  if (banded.length) summary.coverage = inside(banded);
  if (nominalCoverage !== undefined) summary.nominalCoverage = nominalCoverage;
  if (levels) summary.bands = levels.map((nominal, k) => bandScore(scored, nominal, k)).filter((b): b is BandScore => b !== undefined);
  return summary;
}

function bandScore(rows: BacktestRow[], nominal: number, k: number): BandScore | undefined {
  const edges = rows.map((r) => ({ actual: r.actual, lower: r.levels?.[k]?.lower ?? NaN, upper: r.levels?.[k]?.upper ?? NaN }))
    .filter((e) => Number.isFinite(e.lower) && Number.isFinite(e.upper));
  if (edges.length === 0) return undefined;
  const a = edges.map((e) => e.actual);
  const loss = (pinball(a, edges.map((e) => e.lower), (1 - nominal) / 2) + pinball(a, edges.map((e) => e.upper), (1 + nominal) / 2)) / 2;
  return { nominal, coverage: inside(edges), pinball: loss, periods: edges.length };
}

function inside(rows: { actual: number; lower: number; upper: number }[]): number {
  return rows.filter((r) => r.actual >= r.lower && r.actual <= r.upper).length / rows.length;
}
