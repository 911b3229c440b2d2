// npm run bench:layout — one multi-output network per delivery day against
// one single-output network per period, same features, same validation
// block, same settings. Prints validation MAE and training seconds; the
// engine keeps the layout that measured better (the per-day network).
import {
  buildSeries, DEFAULT_LEARNER_SETTINGS, DEFAULT_NETWORK_OPTIONS, DEMO_MARKET, generateMarket, inputFrame, parseCsv, toCsv,
  type FeatureGroup,
} from '../src/engine';
import { fromScaled } from '../src/engine/features/level-scale';
import { loadNetwork, trainNetwork } from '../src/engine/models/network';
import { fitStandardiser, standardise } from '../src/engine/models/standardiser';
import { FeatureCache } from '../src/engine/models/training-days';

const spec = DEMO_MARKET;
const { series } = buildSeries(parseCsv(toCsv(generateMarket(spec, 1)), spec.name), { zone: spec.zone });
const frame = inputFrame(series);
const groups = DEFAULT_LEARNER_SETTINGS.groups.filter((g) => g !== 'price_year_ago') as FeatureGroup[];
const driverStats: Record<string, { mean: number; sd: number }> = {};
for (const k of Object.keys(frame.drivers)) {
  const v = frame.drivers[k].flatMap((r) => Array.from(r)).filter(Number.isFinite);
  const mean = v.reduce((a, b) => a + b, 0) / v.length;
  driverStats[k] = { mean, sd: Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / v.length) };
}
const cache = new FeatureCache({ groups, drivers: Object.keys(frame.drivers), driverStats, region: spec.region, scaleWindow: 28, slots: frame.slots });
const days = cache.trainingDays(frame, 0, frame.price.length);
const val = days.slice(-91), train = days.slice(0, -91);
const st = fitStandardiser(train.map((d) => d.x));
const m = frame.slots;
const lo = -6, hi = 6; // fixed unit map for both layouts
const unit = (z: number) => 0.1 + (0.8 * (z - lo)) / (hi - lo);
const back = (u: number) => lo + ((u - 0.1) * (hi - lo)) / 0.8;
const inputs = (ds: typeof train) => ds.map((d) => standardise(d.x, st));
const trainIn = inputs(train), valIn = inputs(val);
const options = { ...DEFAULT_NETWORK_OPTIONS, ensemble: 1 };

function maeOf(pred: (i: number, slot: number) => number): number {
  let s = 0, n = 0;
  val.forEach((d, i) => { for (let c = 0; c < m; c++) { s += Math.abs(frame.price[d.day][c] - fromScaled(back(pred(i, c)), d.scale)); n++; } });
  return s / n;
}

let t = Date.now();
const perDaySamples = train.map((d, i) => ({ input: trainIn[i], output: d.y!.map(unit) }));
const dayNet = loadNetwork(trainNetwork(perDaySamples, options, 1, (run) => maeOf((i, c) => run(valIn[i])[c])).json);
const perDayOut = valIn.map((x) => dayNet(x));
const perDay = { mae: maeOf((i, c) => perDayOut[i][c]), seconds: (Date.now() - t) / 1000 };

t = Date.now();
const perPeriodOut = valIn.map(() => new Float64Array(m));
for (let c = 0; c < m; c++) {
  const samples = train.map((d, i) => ({ input: trainIn[i], output: Float64Array.of(unit(d.y![c])) }));
  const loss = (run: (x: Float64Array) => Float64Array) => {
    let s = 0;
    val.forEach((d, i) => { s += Math.abs(frame.price[d.day][c] - fromScaled(back(run(valIn[i])[0]), d.scale)); });
    return s / val.length;
  };
  const net = loadNetwork(trainNetwork(samples, options, 1 + c, loss).json);
  valIn.forEach((x, i) => { perPeriodOut[i][c] = net(x)[0]; });
}
const perPeriod = { mae: maeOf((i, c) => perPeriodOut[i][c]), seconds: (Date.now() - t) / 1000 };

console.log(`validation block: last 91 days of ${spec.name}, ${train.length} training days, hidden ${options.hiddenLayers}`);
console.log(`one network per delivery day (${m} outputs): MAE ${perDay.mae.toFixed(3)} in ${perDay.seconds.toFixed(1)} s`);
console.log(`one network per period (${m} networks):      MAE ${perPeriod.mae.toFixed(3)} in ${perPeriod.seconds.toFixed(1)} s`);
console.log(JSON.stringify({ perDay, perPeriod }));
