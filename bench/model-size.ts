// npm run bench: how large a saved model file is. Trains the default blend
// (three networks and the linear part) on the last two years of each invented
// market (hourly Brindlemoor, quarter-hourly Saltbush Reach) and prints the
// file's size, the size of each stored part, how far save → load moves a
// forecast (budget 1e-4 of the price range), and the target of issue #13
// (≤ 256 KB hourly, ≤ 512 KB quarter-hourly). Measured, not asserted.
// BENCH_MODEL_DIR keeps the model texts there (for a look at them).
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  addDays, buildSeries, createModel, DEFAULT_NETWORK_OPTIONS, DEMO_MARKET, frameBefore, generateMarket, inputFrame, Learner, learnerFromStored, parseCsv, parseStoredModel,
  SOLAR_MARKET, storedModelText, toCsv, toStoredModel, type MarketSpec,
} from '../src/engine';

const TARGET_KB: Record<number, number> = { 60: 256, 15: 512 };

/** The largest change of a forecast or band edge, over the last 28 days, through save → load, per price range. */
function movedByFile(model: Learner, text: string, frame: ReturnType<typeof inputFrame>): number {
  const loaded = learnerFromStored(parseStoredModel(text));
  const stored = parseStoredModel(text);
  let moved = 0;
  for (let d = frame.days.length - 28; d < frame.days.length; d++) {
    const a = model.predict(frameBefore(frame, d)), b = loaded.predict(frameBefore(frame, d));
    for (const k of ['point', 'lower', 'upper'] as const) a[k]?.forEach((v, i) => { moved = Math.max(moved, Math.abs(v - b[k]![i])); });
  }
  return moved / (stored.priceRange.hi - stored.priceRange.lo);
}

function trained(spec: MarketSpec): { text: string; resolution: number; seconds: number; moved: number } {
  const rows = generateMarket(spec, 1);
  const from = addDays(rows[rows.length - 1].timestamp.slice(0, 10), -730);
  const { series } = buildSeries(parseCsv(toCsv(rows.filter((r) => r.timestamp.slice(0, 10) >= from)), spec.name), { zone: spec.zone });
  const frame = inputFrame(series);
  const view = frameBefore(frame, frame.days.length - 1);
  const model = createModel('blend', { seed: 1, region: spec.region, network: { ...DEFAULT_NETWORK_OPTIONS } });
  if (!(model instanceof Learner)) throw new Error('blend is a Learner');
  const t = Date.now();
  model.fit(view);
  const seconds = (Date.now() - t) / 1000;
  const text = storedModelText(toStoredModel(model, { name: 'bench', zone: spec.zone, resolution: series.resolution }));
  return { text, resolution: series.resolution, seconds, moved: movedByFile(model, text, frame) };
}

for (const spec of [DEMO_MARKET, SOLAR_MARKET]) {
  const { text, resolution, seconds, moved } = trained(spec);
  const kb = text.length / 1024;
  const target = TARGET_KB[resolution];
  console.log(`${`model file, ${spec.name} (${resolution} min), blend of 3 networks, 2 years`.padEnd(64)}${kb.toFixed(0).padStart(10)} KB  target ≤ ${target} KB: ${kb <= target ? 'met' : 'MISSED'}  (trained in ${seconds.toFixed(0)} s)`);
  const parts = Object.entries(JSON.parse(text) as Record<string, unknown>).map(([k, v]) => [k, JSON.stringify(v).length / 1024] as const);
  console.log(`  largest change of a forecast or band edge through save → load: ${moved.toExponential(1)} of the price range (budget 1e-4)`);
  console.log(`  parts: ${parts.filter(([, n]) => n >= 1).sort((a, b) => b[1] - a[1]).map(([k, n]) => `${k} ${n.toFixed(0)} KB`).join(', ')}`);
  if (process.env.BENCH_MODEL_DIR) writeFileSync(join(process.env.BENCH_MODEL_DIR, `${spec.name.replace(/\W+/g, '-')}.json`), text);
}
