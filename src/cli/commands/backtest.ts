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
  const { nominalCoverage, bands, ...scores } = summary;
  if (flags.json) {
    process.stdout.write(`${JSON.stringify({ ...scores, nominal_coverage: nominalCoverage, bands, retrain_every: retrainEvery })}\n`);
    return;
  }
  const f = (x: number) => (Number.isFinite(x) ? x.toFixed(3) : 'n/a');
  const pct = (x: number) => `${(100 * x).toFixed(1)} %`;
  process.stdout.write(
    `${summary.model}: ${summary.days} ${summary.days === 1 ? 'day' : 'days'}, ${summary.periods} periods, MAE ${f(summary.mae)}, RMSE ${f(summary.rmse)}, ` +
    `sMAPE ${f(summary.smape)} %, rMAE ${f(summary.rmae)}` +
    (summary.coverage !== undefined ? `, band coverage ${pct(summary.coverage)}${nominalCoverage !== undefined ? ` (nominal ${pct(nominalCoverage)})` : ''}` : '') +
    ` (${summary.seconds.toFixed(1)} s)\n`,
  );
  if (bands?.length) {
    process.stdout.write(`bands: ${bands.map((b) => `nominal ${pct(b.nominal)} covered ${pct(b.coverage)}, pinball ${f(b.pinball)}`).join('; ')}\n`);
  }
}
