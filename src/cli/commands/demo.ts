import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  buildSeries, createModel, DEMO_MARKET, generateMarket, inputFrame, parseCsv, runBacktest, toCsv, type BacktestSummary,
} from '../../engine';
import { stderrProgress } from '../progress';

export interface DemoFlags {
  out: string;
}

const DEMO_MODELS = ['naive-day', 'naive-week', 'weekday-rule', 'linear', 'blend'];
const TEST_DAYS = 28;

/**
 * The invented scenario end to end: writes the demo market's CSV, then
 * backtests the baselines and the learned models on its last four weeks
 * and prints the scores.
 */
export async function demoCommand(flags: DemoFlags): Promise<void> {
  mkdirSync(flags.out, { recursive: true });
  const csv = toCsv(generateMarket(DEMO_MARKET, 1));
  const file = join(flags.out, 'demo-market.csv');
  writeFileSync(file, csv);
  process.stderr.write(`demo: wrote ${file} (${DEMO_MARKET.description})\n`);
  const { series } = buildSeries(parseCsv(csv, file), { zone: DEMO_MARKET.zone });
  const frame = inputFrame(series);
  const testStart = frame.days[frame.days.length - TEST_DAYS].date;
  const results: BacktestSummary[] = [];
  for (const name of DEMO_MODELS) {
    const model = createModel(name, { seed: 1, region: DEMO_MARKET.region });
    results.push(runBacktest(model, frame, series, {
      testStart, retrainEvery: model.defaultRetrainEvery ?? 0, progress: stderrProgress(`demo ${name}`),
    }).summary);
  }
  process.stdout.write(`Backtest on ${DEMO_MARKET.name}, ${TEST_DAYS} days from ${testStart}:\n`);
  process.stdout.write(`${'model'.padEnd(14)}${['MAE', 'RMSE', 'sMAPE %', 'rMAE'].map((h) => h.padStart(10)).join('')}\n`);
  for (const r of results) {
    process.stdout.write(`${r.model.padEnd(14)}${[r.mae, r.rmse, r.smape, r.rmae].map((v) => v.toFixed(3).padStart(10)).join('')}\n`);
  }
  process.stdout.write(`Try it yourself: npx spotloom backtest --input ${file} --test-start ${testStart} --region ${DEMO_MARKET.region} --json\n`);
  process.stdout.write('Forecasts are estimates with stated error, not trading advice; check them against your desk\'s risk rules and the market\'s own rules.\n');
}
