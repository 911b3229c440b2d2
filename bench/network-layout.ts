// npm run bench:layout — one multi-output network per delivery day against
// one single-output network per period, same features, same blocks, same
// settings. Prints the holdout MAE and training seconds; the engine keeps the
// layout that measured better (the per-day network).
import {
  buildSeries, DEFAULT_LEARNER_SETTINGS, DEFAULT_NETWORK_OPTIONS, DEMO_MARKET, frameBefore, generateMarket, inputFrame, parseCsv, toCsv,
} from '../src/engine';
import { fromScaled } from '../src/engine/features/level-scale';
import { trainingBlocks } from '../src/engine/models/blocks';
import { chooseSetup } from '../src/engine/models/choose-setup';
import { loadNetwork, trainNetwork } from '../src/engine/models/network';
import { fitStandardiser, standardise } from '../src/engine/models/standardiser';
import { FeatureCache } from '../src/engine/models/training-days';

const spec = DEMO_MARKET;
const { series } = buildSeries(parseCsv(toCsv(generateMarket(spec, 1)), spec.name), { zone: spec.zone });
const frame = inputFrame(series);
const settings = { ...DEFAULT_LEARNER_SETTINGS, region: spec.region };
// the engine's own cut (models/blocks.ts): fit, tuning (early stopping), holdout (the score);
// feature setup, driver statistics and standardiser from the fit block alone, as the learner does
const probe = new FeatureCache(chooseSetup(frame, settings).setup).trainingDays(frame, 0, frame.price.length);
const blocks = trainingBlocks(probe.length);
const firstTuning = probe[blocks.fit].day;
const cache = new FeatureCache(chooseSetup(frameBefore(frame, firstTuning), settings).setup);
const days = cache.trainingDays(frame, 0, frame.price.length);
const train = days.slice(0, blocks.fit), tune = days.slice(blocks.fit, blocks.fit + blocks.tuning), val = days.slice(blocks.fit + blocks.tuning);
const st = fitStandardiser(train.map((d) => d.x));
const m = frame.slots;
const lo = -6, hi = 6; // fixed unit map for both layouts
const unit = (z: number) => 0.1 + (0.8 * (z - lo)) / (hi - lo);
const back = (u: number) => lo + ((u - 0.1) * (hi - lo)) / 0.8;
const inputs = (ds: typeof train) => ds.map((d) => standardise(d.x, st));
const trainIn = inputs(train), tuneIn = inputs(tune), valIn = inputs(val);
const options = { ...DEFAULT_NETWORK_OPTIONS, ensemble: 1 };

function maeOn(block: typeof val, pred: (i: number, slot: number) => number): number {
  let s = 0, n = 0;
  block.forEach((d, i) => { for (let c = 0; c < m; c++) { s += Math.abs(frame.price[d.day][c] - fromScaled(back(pred(i, c)), d.scale)); n++; } });
  return s / n;
}

let t = Date.now();
const perDaySamples = train.map((d, i) => ({ input: trainIn[i], output: d.y!.map(unit) }));
const dayNet = loadNetwork(trainNetwork(perDaySamples, options, 1, (run) => maeOn(tune, (i, c) => run(tuneIn[i])[c])).json);
const perDayOut = valIn.map((x) => dayNet(x));
const perDay = { mae: maeOn(val, (i, c) => perDayOut[i][c]), seconds: (Date.now() - t) / 1000 };

t = Date.now();
const perPeriodOut = valIn.map(() => new Float64Array(m));
for (let c = 0; c < m; c++) {
  const samples = train.map((d, i) => ({ input: trainIn[i], output: Float64Array.of(unit(d.y![c])) }));
  const loss = (run: (x: Float64Array) => Float64Array) => {
    let s = 0;
    tune.forEach((d, i) => { s += Math.abs(frame.price[d.day][c] - fromScaled(back(run(tuneIn[i])[0]), d.scale)); });
    return s / tune.length;
  };
  const net = loadNetwork(trainNetwork(samples, options, 1 + c, loss).json);
  valIn.forEach((x, i) => { perPeriodOut[i][c] = net(x)[0]; });
}
const perPeriod = { mae: maeOn(val, (i, c) => perPeriodOut[i][c]), seconds: (Date.now() - t) / 1000 };

console.log(`${spec.name}: ${train.length} fit days, early stopping on the next ${tune.length}, scored on the last ${val.length} (no part in any choice); hidden ${options.hiddenLayers}`);
console.log(`one network per delivery day (${m} outputs): MAE ${perDay.mae.toFixed(3)} in ${perDay.seconds.toFixed(1)} s`);
console.log(`one network per period (${m} networks):      MAE ${perPeriod.mae.toFixed(3)} in ${perPeriod.seconds.toFixed(1)} s`);
console.log(JSON.stringify({ perDay, perPeriod }));
