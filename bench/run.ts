// npm run bench: accuracy and speed of every model on the two invented
// markets. Prints a table and, last, one JSON line. Not a test: numbers are
// measured, not asserted.
import {
  buildSeries, createModel, DEFAULT_NETWORK_OPTIONS, Learner, storedModelText, toStoredModel, DEMO_MARKET, generateMarket, inputFrame, parseCsv, runBacktest, SOLAR_MARKET, toCsv,
  type MarketSpec,
} from '../src/engine';

const TEST_DAYS = Number(process.env.BENCH_TEST_DAYS ?? 91);
const MODELS = (process.env.BENCH_MODELS ?? 'blend,neural,linear,lear,weekday-rule,naive-week').split(',');
const MARKETS = (process.env.BENCH_MARKETS ?? 'demo,solar').split(',');
// e.g. BENCH_OPTIONS='{"network":{"hiddenLayers":[16]}}' to try other settings
const OPTIONS = JSON.parse(process.env.BENCH_OPTIONS ?? '{}');

interface Row {
  market: string; model: string; mae: number; rmae: number; smape: number; coverage: number | null;
  trainSeconds: number; backtestSeconds: number; forecastMs: number; modelKB: number | null;
}

function bench(spec: MarketSpec): Row[] {
  const csv = toCsv(generateMarket(spec, 1));
  const { series } = buildSeries(parseCsv(csv, spec.name), { zone: spec.zone });
  const frame = inputFrame(series);
  const testStart = frame.days[frame.days.length - TEST_DAYS].date;
  const rows: Row[] = [];
  for (const name of MODELS) {
    const model = createModel(name, { seed: 1, region: spec.region, ...OPTIONS, network: { ...DEFAULT_NETWORK_OPTIONS, ...OPTIONS.network } });
    let trainSeconds = 0;
    const fit = model.fit.bind(model);
    model.fit = (view, progress) => { const t = Date.now(); fit(view, progress); trainSeconds = (Date.now() - t) / 1000; };
    let predictMs = 0, predictions = 0;
    const predict = model.predict.bind(model);
    model.predict = (view) => { const t = performance.now(); const f = predict(view); predictMs += performance.now() - t; predictions++; return f; };
    const { summary } = runBacktest(model, frame, series, { testStart, retrainEvery: model.defaultRetrainEvery ?? 0 });
    const modelKB = model instanceof Learner
      ? storedModelText(toStoredModel(model, { name: 'bench', zone: spec.zone, resolution: series.resolution })).length / 1024 : null;
    rows.push({
      market: spec.name, model: name, mae: summary.mae, rmae: summary.rmae, smape: summary.smape,
      coverage: summary.coverage ?? null, trainSeconds, backtestSeconds: summary.seconds, forecastMs: predictMs / Math.max(1, predictions), modelKB,
    });
    process.stderr.write(`${spec.name} ${name}: MAE ${summary.mae.toFixed(3)} rMAE ${summary.rmae.toFixed(3)} ${summary.coverage !== undefined ? `coverage ${(summary.coverage * 100).toFixed(1)} % ` : ''}(${summary.seconds.toFixed(1)} s)\n`);
  }
  return rows;
}

const all: Row[] = [];
if (MARKETS.includes('demo')) all.push(...bench(DEMO_MARKET));
if (MARKETS.includes('solar')) all.push(...bench(SOLAR_MARKET));
const head = ['market', 'model', 'MAE', 'rMAE', 'sMAPE %', 'cover %', 'train s', 'backtest s', 'forecast ms', 'model KB'];
console.log(head.map((h, i) => (i < 2 ? h.padEnd(15) : h.padStart(11))).join(''));
for (const r of all) {
  const cells = [r.mae.toFixed(3), r.rmae.toFixed(3), r.smape.toFixed(2), r.coverage === null ? '-' : (100 * r.coverage).toFixed(1),
    r.trainSeconds.toFixed(1), r.backtestSeconds.toFixed(1), r.forecastMs.toFixed(2), r.modelKB === null ? '-' : r.modelKB.toFixed(0)];
  console.log(r.market.padEnd(15) + r.model.padEnd(15) + cells.map((c) => c.padStart(11)).join(''));
}
console.log(JSON.stringify({ testDays: TEST_DAYS, results: all }));
