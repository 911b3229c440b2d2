import type { DayFrame } from '../series/day-frame';

/** A forecast of one delivery day on its clock slots (see day-matrix.ts). */
export interface DayForecast {
  point: Float64Array;
  /** the band at the model's own coverage */
  lower?: Float64Array;
  upper?: Float64Array;
  /** bands at the reported coverages (bands.ts REPORTED_COVERAGES), for backtest scores */
  bands?: { coverage: number; lower: Float64Array; upper: Float64Array }[];
}

/** Progress of long work; `value` carries a measured number when there is one (a network's validation loss). */
export interface Progress {
  (done: number, total: number, what: string, value?: number): void;
}

/**
 * A day-ahead model. It is fitted on a view (frameBefore) and forecasts
 * the view's target day: the day right after the view's last price row.
 * `update` refreshes it on a later view during a backtest or in daily use.
 */
export interface DayAheadModel {
  readonly name: string;
  /** whole days of price history needed before the first forecast */
  readonly minHistoryDays: number;
  /** the refresh schedule used when --retrain-every is not given (days; 0 = never) */
  readonly defaultRetrainEvery?: number;
  /** nominal coverage of `lower` … `upper`, when the model gives bands */
  readonly coverage?: number;
  fit(view: DayFrame, progress?: Progress): void;
  predict(view: DayFrame): DayForecast;
  update?(view: DayFrame, progress?: Progress): void;
}
