import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  addDays, buildSeries, createModel, DEMO_MARKET, generateMarket, InputError, inputFrame, parseCsv, runBacktest, toCsv, type BacktestSummary,
} from '../../engine';
import { stderrProgress } from '../progress';

export interface DemoFlags {
  out: string;
}

const DEMO_MODELS = ['naive-day', 'naive-week', 'weekday-rule', 'linear', 'blend'];
const TEST_DAYS = 28;

/**
 * The invented scenario end to end. Writes the files of a desk's morning
 * on the demo market's last day D (README, "A desk's morning"):
 * - `demo-market.csv`: the history, prices and drivers up to D-1;
 * - `drivers-D.csv`: the driver forecasts for D, as they come in that morning;
 * - `prices-D.csv`: D's prices, as the auction publishes them later;
 * then backtests the baselines and the learned models on the history's
 * last four weeks and prints the scores.
 */
export async function demoCommand(flags: DemoFlags): Promise<void> {
  try {
    mkdirSync(flags.out, { recursive: true });
  } catch (err) {
    throw new InputError(`cannot be made as a folder (${(err as NodeJS.ErrnoException).code ?? 'unknown error'})`, { file: flags.out });
  }
  const rows = generateMarket(DEMO_MARKET, 1);
  const day = DEMO_MARKET.end;
  const split = rows.findIndex((r) => r.timestamp.startsWith(day));
  const csv = toCsv(rows.slice(0, split));
  const next = toCsv(rows.slice(split)).trimEnd().split('\n').map((line) => line.split(','));
  const file = join(flags.out, 'demo-market.csv');
  const driversFile = join(flags.out, `drivers-${day}.csv`);
  const pricesFile = join(flags.out, `prices-${day}.csv`);
  write(file, csv);
  write(driversFile, lines(next.map((cells) => cells.filter((_, c) => c !== 1))));
  write(pricesFile, lines(next.map((cells) => cells.slice(0, 2))));
  process.stderr.write(`demo: wrote ${file} (${DEMO_MARKET.description}; history up to the day before ${day}), ${driversFile} and ${pricesFile}\n`);

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
  process.stdout.write(`A desk's morning (README), on ${addDays(day, -1)}: train on ${file}, forecast with --drivers ${driversFile}, score what was issued with --actuals ${pricesFile}.\n`);
  process.stdout.write('Forecasts are estimates with stated error, not trading advice; check them against your desk\'s risk rules and the market\'s own rules.\n');
}

function lines(cells: string[][]): string {
  return `${cells.map((c) => c.join(',')).join('\n')}\n`;
}

function write(file: string, text: string): void {
  try {
    writeFileSync(file, text);
  } catch (err) {
    throw new InputError(`cannot be written (${(err as NodeJS.ErrnoException).code ?? 'unknown error'})`, { file });
  }
}
