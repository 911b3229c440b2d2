// npm run bench:models: accuracy of every model on the three invented
// markets, each with its full history and with only 6 weeks of it, beside the
// generator's own floor (generateMarketWithOracle). Prints a table, the
// band coverage per nominal level, a markdown table for the README and, last,
// one JSON line. Not a test: numbers are measured, not asserted.
import {
  buildSeries, createModel, DEFAULT_NETWORK_OPTIONS, Learner, storedModelText, toStoredModel, DEMO_MARKET, generateMarketWithOracle, inputFrame,
  parseCsv, runBacktest, SHIFT_MARKET, SOLAR_MARKET, toCsv, type BacktestSummary, type MarketSpec,
} from '../src/engine';

const TEST_DAYS = Number(process.env.BENCH_TEST_DAYS ?? 91);
// e.g. BENCH_TEST_START=2026-05-10 BENCH_TEST_END=2026-08-08 for a span before a market's end (default: its last TEST_DAYS days)
const TEST_START = process.env.BENCH_TEST_START;
const TEST_END = process.env.BENCH_TEST_END;
const MODELS = (process.env.BENCH_MODELS ?? 'blend,neural,linear,lear,weekday-rule,naive-week').split(',');
const MARKETS = (process.env.BENCH_MARKETS ?? 'demo,solar,shift').split(',');
/** history before the test span: 'full', or a number of days (6 weeks = 42) */
const HISTORIES = (process.env.BENCH_HISTORY ?? 'full,42').split(',');
// e.g. BENCH_OPTIONS='{"network":{"hiddenLayers":[16]}}' to try other settings
const OPTIONS = JSON.parse(process.env.BENCH_OPTIONS ?? '{}');
const SPECS: Record<string, MarketSpec> = { demo: DEMO_MARKET, solar: SOLAR_MARKET, shift: SHIFT_MARKET };

interface Row {
  market: string; history: string; model: string; mae: number; floor: number; rmae: number; smape: number;
  coverage: number | null; bands: BacktestSummary['bands']; trainSeconds: number; backtestSeconds: number; forecastMs: number; modelKB: number | null;
}

function bench(spec: MarketSpec, history: string): Row[] {
  const { rows: all, oracle } = generateMarketWithOracle(spec, 1);
  const dates = [...new Set(all.map((r) => r.timestamp.slice(0, 10)))];
  const testStart = TEST_START ?? dates[dates.length - TEST_DAYS];
  const firstDay = history === 'full' ? dates[0] : dates[dates.indexOf(testStart) - Number(history)];
  const kept = all.map((r, i) => ({ r, i })).filter(({ r }) => r.timestamp.slice(0, 10) >= firstDay);
  const test = kept.filter(({ r }) => r.timestamp.slice(0, 10) >= testStart && (!TEST_END || r.timestamp.slice(0, 10) <= TEST_END));
  const floor = test.reduce((s, { r, i }) => s + Math.abs(r.price - oracle[i]), 0) / test.length;
  const { series } = buildSeries(parseCsv(toCsv(kept.map(({ r }) => r)), spec.name), { zone: spec.zone });
  const frame = inputFrame(series);
  const out: Row[] = [];
  for (const name of MODELS) {
    const model = createModel(name, { seed: 1, region: spec.region, ...OPTIONS, network: { ...DEFAULT_NETWORK_OPTIONS, ...OPTIONS.network } });
    let trainSeconds = 0;
    const fit = model.fit.bind(model);
    model.fit = (view, progress) => { const t = Date.now(); fit(view, progress); trainSeconds = (Date.now() - t) / 1000; };
    let predictMs = 0, predictions = 0;
    const predict = model.predict.bind(model);
    model.predict = (view) => { const t = performance.now(); const f = predict(view); predictMs += performance.now() - t; predictions++; return f; };
    let summary: BacktestSummary;
    try {
      summary = runBacktest(model, frame, series, { testStart, testEnd: TEST_END, retrainEvery: model.defaultRetrainEvery ?? 0 }).summary;
    } catch (err) {
      process.stderr.write(`${spec.name} ${history} ${name}: ${(err as Error).message}\n`);
      continue;
    }
    const modelKB = model instanceof Learner
      ? storedModelText(toStoredModel(model, { name: 'bench', zone: spec.zone, resolution: series.resolution })).length / 1024 : null;
    out.push({
      market: spec.name, history, model: name, mae: summary.mae, floor, rmae: summary.rmae, smape: summary.smape,
      coverage: summary.coverage ?? null, bands: summary.bands, trainSeconds, backtestSeconds: summary.seconds,
      forecastMs: predictMs / Math.max(1, predictions), modelKB,
    });
    process.stderr.write(`${spec.name} ${history} ${name}: MAE ${summary.mae.toFixed(3)} (floor ${floor.toFixed(3)}, ×${(summary.mae / floor).toFixed(3)}) rMAE ${summary.rmae.toFixed(3)} (${summary.seconds.toFixed(1)} s)\n`);
  }
  return out;
}

const rows: Row[] = [];
for (const m of MARKETS) for (const h of HISTORIES) rows.push(...bench(SPECS[m], h));

const pct = (v: number | null | undefined) => (v === null || v === undefined ? '-' : (100 * v).toFixed(1));
const head = ['market', 'history', 'model', 'MAE', '×floor', 'rMAE', 'sMAPE %', 'cover %', 'train s', 'backtest s', 'forecast ms', 'model KB'];
console.log(head.map((h, i) => (i < 3 ? h.padEnd(i === 1 ? 8 : 15) : h.padStart(11))).join(''));
for (const r of rows) {
  const cells = [r.mae.toFixed(3), (r.mae / r.floor).toFixed(3), r.rmae.toFixed(3), r.smape.toFixed(2), pct(r.coverage),
    r.trainSeconds.toFixed(1), r.backtestSeconds.toFixed(1), r.forecastMs.toFixed(2), r.modelKB === null ? '-' : r.modelKB.toFixed(0)];
  console.log(r.market.padEnd(15) + r.history.padEnd(8) + r.model.padEnd(15) + cells.map((c) => c.padStart(11)).join(''));
}

console.log('\nband coverage % at each nominal level (pinball loss)');
for (const r of rows.filter((x) => x.bands?.length)) {
  console.log(`${r.market.padEnd(15)}${r.history.padEnd(8)}${r.model.padEnd(10)}${r.bands!.map((b) => `${pct(b.nominal)}: ${pct(b.coverage)} (${b.pinball.toFixed(2)})`.padEnd(22)).join('')}`);
}

console.log('\n| market | history | model | MAE | × floor | rMAE | 50 / 80 / 90 / 98 % bands cover | backtest s |');
console.log('|---|---|---|---:|---:|---:|---|---:|');
for (const r of rows) {
  const bands = r.bands?.length ? r.bands.map((b) => pct(b.coverage)).join(' / ') : '-';
  const history = r.history === 'full' ? 'full' : `${r.history} days`;
  console.log(`| ${r.market} | ${history} | ${r.model} | ${r.mae.toFixed(2)} | ${(r.mae / r.floor).toFixed(2)} | ${r.rmae.toFixed(3)} | ${bands} | ${r.backtestSeconds.toFixed(0)} |`);
}
console.log(JSON.stringify({ testDays: TEST_DAYS, results: rows }));
