import type { BacktestSummary, LearnerSettings, Series } from '../../engine';

/**
 * Messages between the pane and its training worker (train-worker.ts).
 * Everything is plain data (structured clone): a series crosses as its
 * arrays, a trained model comes back as its stored text, never half of it.
 */
export type Job =
  | { type: 'train'; series: Series; settings: LearnerSettings; name: string }
  | {
    type: 'backtest';
    series: Series;
    /** settings of the learned model to walk forward; null for the baselines alone */
    settings: LearnerSettings | null;
    /** name shown for the learned model in the results */
    label: string;
    /** delivery days in the test span, ending with the last day that has prices */
    days: number;
    /** days between model refreshes; the model's own default when left out */
    retrainEvery?: number;
  };

export interface ProgressReply {
  type: 'progress';
  /** 0 … 1 over the whole job */
  fraction: number;
  what: string;
  done: number;
  total: number;
  /** validation loss (MAE) at a check, when the engine reports it */
  loss?: number;
  /** with a loss: which network of the ensemble (0-based) and its own epoch count */
  network?: number;
  epoch?: number;
}

/** One test period with every model's forecast beside the actual price. */
export interface CheckRow {
  time: number;
  actual: number;
  forecast: number;
  lower: number;
  upper: number;
  naiveWeek: number;
  weekdayRule: number;
}

export interface BacktestOutcome {
  testStart: string;
  testEnd: string;
  /** the learned model (when given) first, then naive-week and weekday-rule */
  summaries: BacktestSummary[];
  rows: CheckRow[];
}

export type Reply =
  | ProgressReply
  | { type: 'trained'; text: string; seconds: number }
  | { type: 'backtested'; outcome: BacktestOutcome }
  | { type: 'failed'; message: string };
