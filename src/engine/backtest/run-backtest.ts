import { baselineForecast } from '../baselines/naive';
import { InputError } from '../errors';
import { REPORTED_COVERAGES } from '../models/bands';
import type { DayAheadModel, Progress } from '../models/model';
import { dayIndexOf, frameBefore, type DayFrame } from '../series/day-frame';
import { expandDay } from '../series/day-matrix';
import type { Series } from '../series/series';
import { summarise, type BacktestSummary } from './summarise';

export interface BacktestRow {
  time: number;
  forecast: number;
  lower: number;
  upper: number;
  actual: number;
  /** naive-week forecast of the same period, the yardstick of rMAE */
  naiveWeek: number;
  day: number;
  /** lower and upper edge at each reported coverage (summary `bands`), when the model gives them */
  levels?: { lower: number; upper: number }[];
}

export interface BacktestOptions {
  /** first local delivery day forecast (YYYY-MM-DD) */
  testStart: string;
  /** last local delivery day forecast (inclusive), default: last day with a price */
  testEnd?: string;
  /** refresh the model (model.update) every this many days; 0 = never */
  retrainEvery?: number;
  progress?: Progress;
  /** checked between days; set `aborted` to stop early */
  signal?: { aborted: boolean };
}

export interface BacktestResult {
  rows: BacktestRow[];
  summary: BacktestSummary;
}

/**
 * Walks forward through the test span. The model is fitted on every day
 * before `testStart`; then for each delivery day D it forecasts all periods
 * of D from a view holding prices up to D-1 and drivers up to D
 * (frameBefore), so nothing from D or later can reach the forecast for D.
 *
 * @param frame  model inputs (missing values filled only from earlier days)
 * @param series the series the frame was made from; its raw prices are the actuals
 * @throws InputError when the test span is outside the data or leaves too little history
 */
export function runBacktest(
  model: DayAheadModel, frame: DayFrame, series: Pick<Series, 'times' | 'price'>, options: BacktestOptions,
): BacktestResult {
  const started = Date.now();
  const actual = series.price;
  const { testStart, testEnd, retrainEvery = 0, progress, signal } = options;
  const { first, last } = testSpan(frame, actual, testStart, testEnd);
  if (first < model.minHistoryDays) {
    throw new InputError(
      `--test-start ${testStart} leaves ${first} days of history before it; model ${model.name} needs at least ${model.minHistoryDays}`,
    );
  }
  model.fit(frameBefore(frame, first), progress);
  const rows: BacktestRow[] = [];
  const total = last - first + 1;
  for (let d = first; d <= last; d++) {
    if (signal?.aborted) throw new InputError('the backtest was cancelled');
    const view = frameBefore(frame, d);
    if (model.update && retrainEvery > 0 && d > first && (d - first) % retrainEvery === 0) model.update(view);
    const forecast = model.predict(view);
    const naive = baselineForecast('naive-week', view).point;
    const day = frame.days[d];
    const point = expandDay(day, forecast.point);
    const lower = forecast.lower ? expandDay(day, forecast.lower) : undefined;
    const upper = forecast.upper ? expandDay(day, forecast.upper) : undefined;
    const yard = expandDay(day, naive);
    const levels = forecast.bands?.map((b) => ({ lower: expandDay(day, b.lower), upper: expandDay(day, b.upper) }));
    for (let j = 0; j < day.count; j++) {
      const i = day.start + j;
      rows.push({
        time: series.times[i], forecast: point[j], lower: lower ? lower[j] : NaN, upper: upper ? upper[j] : NaN,
        actual: actual[i], naiveWeek: yard[j], day: d,
        ...(levels ? { levels: levels.map((b) => ({ lower: b.lower[j], upper: b.upper[j] })) } : {}),
      });
    }
    progress?.(d - first + 1, total, 'forecast days');
  }
  return { rows, summary: summarise(model.name, rows, (Date.now() - started) / 1000, model.coverage, levelsOf(model)) };
}

/** The coverages of the bands a learned model reports (a model without bands reports none). */
function levelsOf(model: DayAheadModel): number[] | undefined {
  return model.coverage === undefined ? undefined : REPORTED_COVERAGES;
}

function testSpan(frame: DayFrame, actual: ArrayLike<number>, testStart: string, testEnd?: string) {
  const days = frame.days;
  const lastDate = days[days.length - 1].date;
  if (!/^\d{4}-\d{2}-\d{2}$/.test(testStart)) throw new InputError(`--test-start "${testStart}" is not a date YYYY-MM-DD`);
  if (testEnd !== undefined && !/^\d{4}-\d{2}-\d{2}$/.test(testEnd)) throw new InputError(`--test-end "${testEnd}" is not a date YYYY-MM-DD`);
  if (testEnd !== undefined && testEnd < testStart) throw new InputError(`--test-end ${testEnd} is before --test-start ${testStart}`);
  const first = dayIndexOf(frame, testStart);
  if (first < 0 || (first === 0 && days[0].date > testStart)) {
    throw new InputError(`--test-start ${testStart} is outside the data, which covers ${days[0].date} to ${lastDate}`);
  }
  let last = days.length - 1;
  while (last >= first && (days[last].date > (testEnd ?? lastDate) || !hasActual(actual, days[last].start, days[last].count))) last--;
  if (last < first) {
    throw new InputError(`the test span from ${testStart} holds no day with known prices (the data covers ${days[0].date} to ${lastDate})`);
  }
  return { first, last };
}

function hasActual(actual: ArrayLike<number>, start: number, count: number): boolean {
  for (let i = start; i < start + count; i++) if (!Number.isNaN(actual[i])) return true;
  return false;
}
