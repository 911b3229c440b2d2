import { mae } from '../metrics/mae';
import { rmse } from '../metrics/rmse';
import { smape } from '../metrics/smape';
import type { BacktestRow } from './run-backtest';

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
}

/** Scores the rows that have both a forecast and an actual price. */
export function summarise(model: string, rows: BacktestRow[], seconds: number): BacktestSummary {
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
  if (banded.length) summary.coverage = banded.filter((r) => r.actual >= r.lower && r.actual <= r.upper).length / banded.length;
  return summary;
}
