import {
  baselineModel, InputError, inputFrame, Learner, runBacktest, storedModelText, toStoredModel,
  type BacktestResult, type DayFrame,
} from '../../engine';
import type { BacktestOutcome, CheckRow, Job, ProgressReply, Reply } from './protocol';

/**
 * Where a progress report of the engine lands on the job's 0…1 bar. A
 * learned model reports its linear part, then network epochs (most of the
 * time), then its LEAR part (blend), then feature importance; a backtest first fits, then walks the days.
 *
 * @example trainFraction('network epochs', 50, 100) // 0.475
 */
export function trainFraction(what: string, done: number, total: number): number {
  const share = total > 0 ? Math.min(1, Math.max(0, done / total)) : 1;
  if (what === 'linear model') return 0.05;
  if (what === 'network epochs') return 0.05 + 0.85 * share;
  if (what === 'lear part') return 0.92;
  if (what === 'feature importance') return 0.95;
  return share;
}

/**
 * Runs one job to its end and posts what happens: progress replies, then
 * exactly one of trained / backtested / failed. Runs in the worker, and in
 * Node for tests. A user error (InputError) is posted as its message; any
 * other error too, as one line, so the pane never shows a stack.
 */
export function runJob(job: Job, post: (reply: Reply) => void): void {
  try {
    if (job.type === 'train') post(train(job, post));
    else post({ type: 'backtested', outcome: backtest(job, post) });
  } catch (error) {
    const message = error instanceof InputError ? error.message : `training stopped: ${error instanceof Error ? error.message : String(error)}`;
    post({ type: 'failed', message: message.split('\n')[0] });
  }
}

/**
 * Which network of the ensemble a "network epochs" report is about: the
 * engine counts epochs across the ensemble, network k running from
 * k × iterations + 1 to (k + 1) × iterations (Learner.fit).
 *
 * @example ensembleMember(205, 200) // { network: 1, epoch: 5 }
 */
export function ensembleMember(done: number, iterations: number): { network: number; epoch: number } {
  const network = Math.max(0, Math.floor((done - 1) / iterations));
  return { network, epoch: done - network * iterations };
}

function progressTo(post: (r: Reply) => void, map: (what: string, done: number, total: number) => number, iterations?: number) {
  let lastPosted = 0;
  return (done: number, total: number, what: string, loss?: number) => {
    const now = Date.now();
    // every validation check carries a loss for the chart; plain ticks at most every 50 ms
    if (loss === undefined && now - lastPosted < 50 && done < total) return;
    lastPosted = now;
    const reply: ProgressReply = { type: 'progress', fraction: map(what, done, total), what, done, total };
    if (typeof loss === 'number' && Number.isFinite(loss)) {
      reply.loss = loss;
      if (what === 'network epochs' && iterations) Object.assign(reply, ensembleMember(done, iterations));
    }
    post(reply);
  };
}

function train(job: Extract<Job, { type: 'train' }>, post: (r: Reply) => void): Reply {
  const started = Date.now();
  const learner = new Learner(job.settings);
  const frame = inputFrame(job.series);
  if (frame.price.length === 0) throw new InputError('the price range holds no known price to train on');
  learner.fit(frame, progressTo(post, trainFraction, job.settings.network.iterations));
  const stored = toStoredModel(learner, { name: job.name, zone: job.series.zone, resolution: job.series.resolution });
  const text = storedModelText(stored);
  post({ type: 'progress', fraction: 1, what: 'done', done: 1, total: 1 });
  return { type: 'trained', text, seconds: (Date.now() - started) / 1000 };
}

/** The first day of a test span of `days` delivery days ending with the last day that has prices. */
export function testSpanStart(frame: DayFrame, days: number): { testStart: string; testEnd: string } {
  if (!Number.isInteger(days) || days < 1) throw new InputError(`the test span must be a whole number of days of at least 1, got ${days}`);
  const last = frame.price.length - 1;
  if (last < 0) throw new InputError('there is no day with known prices to test on');
  const first = last - days + 1;
  if (first < 8) throw new InputError(`a ${days}-day test span leaves ${Math.max(0, first)} ${Math.max(0, first) === 1 ? 'day' : 'days'} of history before it; pick a shorter span or add history`);
  return { testStart: frame.days[first].date, testEnd: frame.days[last].date };
}

function backtest(job: Extract<Job, { type: 'backtest' }>, post: (r: Reply) => void): BacktestOutcome {
  const frame = inputFrame(job.series);
  const { testStart, testEnd } = testSpanStart(frame, job.days);
  const results: BacktestResult[] = [];
  if (job.settings) {
    const learner = new Learner(job.settings);
    const progress = progressTo(post, (what, done, total) =>
      what === 'forecast days' ? 0.6 + 0.35 * (total > 0 ? done / total : 1) : 0.6 * trainFraction(what, done, total));
    const result = runBacktest(learner, frame, job.series, {
      testStart, testEnd, retrainEvery: job.retrainEvery ?? learner.defaultRetrainEvery, progress,
    });
    result.summary.model = job.label;
    results.push(result);
  }
  for (const kind of ['naive-week', 'weekday-rule'] as const) results.push(runBacktest(baselineModel(kind), frame, job.series, { testStart, testEnd }));
  post({ type: 'progress', fraction: 1, what: 'done', done: 1, total: 1 });
  const [learned, week, rule] = job.settings ? results : [undefined, ...results];
  const byTime = new Map<number, CheckRow>();
  for (const r of week!.rows) {
    byTime.set(r.time, { time: r.time, actual: r.actual, forecast: NaN, lower: NaN, upper: NaN, naiveWeek: r.forecast, weekdayRule: NaN });
  }
  for (const r of rule!.rows) { const row = byTime.get(r.time); if (row) row.weekdayRule = r.forecast; }
  for (const r of learned?.rows ?? []) {
    const row = byTime.get(r.time);
    if (row) Object.assign(row, { forecast: r.forecast, lower: r.lower, upper: r.upper });
  }
  return { testStart, testEnd, summaries: results.map((r) => r.summary), rows: [...byTime.values()] };
}
