import { createModel, formatTimestamp, inputFrame, runBacktest } from '../../engine';
import { dialectChoice, intOption, loadSeries, type DialectFlags } from '../load-input';
import { modelOptions, type ModelFlags } from '../model-flags';
import { stderrProgress } from '../progress';
import { writeCsv } from '../write-csv';

export interface BacktestFlags extends ModelFlags, DialectFlags {
  input: string;
  testStart: string;
  testEnd?: string;
  model: string;
  retrainEvery?: string;
  tz: string;
  missing?: string;
  out?: string;
  json?: boolean;
}

export async function backtestCommand(flags: BacktestFlags): Promise<void> {
  const model = createModel(flags.model, modelOptions(flags));
  const retrainEvery = intOption(flags.retrainEvery, '--retrain-every', 0, model.defaultRetrainEvery ?? 0);
  const { series } = loadSeries(flags.input, flags.tz, 'price', flags.missing, dialectChoice(flags));
  const frame = inputFrame(series);
  const { rows, summary } = runBacktest(model, frame, series, {
    testStart: flags.testStart, testEnd: flags.testEnd, retrainEvery, progress: stderrProgress('backtest'),
  });
  if (flags.out) {
    writeCsv(flags.out, ['timestamp', 'forecast', 'lower', 'upper', 'actual'],
      rows.map((r) => [formatTimestamp(r.time, series.zone), r.forecast, r.lower, r.upper, r.actual]));
  }
  if (flags.json) process.stdout.write(`${JSON.stringify({ ...summary, retrain_every: retrainEvery })}\n`);
  else {
    const f = (x: number) => (Number.isFinite(x) ? x.toFixed(3) : 'n/a');
    process.stdout.write(
      `${summary.model}: ${summary.days} days, ${summary.periods} periods, MAE ${f(summary.mae)}, RMSE ${f(summary.rmse)}, ` +
      `sMAPE ${f(summary.smape)} %, rMAE ${f(summary.rmae)}` +
      (summary.coverage !== undefined ? `, band coverage ${(100 * summary.coverage).toFixed(1)} %` : '') +
      ` (${summary.seconds.toFixed(1)} s)\n`,
    );
  }
}
