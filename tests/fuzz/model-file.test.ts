import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  createModel, forecastAhead, inputFrame, Learner, learnerFromStored, MAX_MODEL_BYTES, parseStoredModel, storedModelText, toStoredModel,
  type ModelOptions, type Series,
} from '../../src/engine';
import { encodeFloats } from '../../src/engine/model-file/base64-floats';
import { syntheticSeries } from '../support/synthetic';
import { outcome, params } from './support';

/**
 * Untrusted model files: random JSON and text, and valid model files with
 * one or a few mutations (wrong types, missing and extra keys, NaN and
 * huge weights, wrong sizes, prototype keys, over-size strings). Each must
 * be refused with an InputError, or load into a model whose forecast for
 * the next day is finite numbers (or an InputError, e.g. a renamed driver).
 */

const SMALL: ModelOptions = { seed: 3, network: { hiddenLayers: [4], learningRate: 0.05, momentum: 0.5, iterations: 5, ensemble: 2, checkEvery: 5, patience: 1 } };

/** History with prices, then the last local day's rows with drivers and an empty price. */
function withOpenDay(s: Series): Series {
  const open = s.times.findIndex((t) => t >= Date.parse('2025-05-04T00:00:00+02:00'));
  const end = s.times.findIndex((t) => t >= Date.parse('2025-05-05T00:00:00+02:00'));
  return { ...s, times: s.times.slice(0, end), price: s.price.slice(0, end).map((p, i) => (i >= open ? NaN : p)), drivers: { load_forecast: s.drivers.load_forecast.slice(0, end) } };
}

let series: Series;
const files: Record<string, string> = {};

beforeAll(() => {
  series = withOpenDay(syntheticSeries(120));
  for (const kind of ['blend', 'linear', 'neural'] as const) {
    const model = createModel(kind, SMALL) as Learner;
    model.fit(inputFrame(series));
    files[kind] = storedModelText(toStoredModel(model, { name: `fuzz ${kind}`, zone: series.zone, resolution: series.resolution, createdAt: '2026-12-01T08:00:00Z' }));
  }
}, 120_000);

const protoKeys = () => Object.getOwnPropertyNames(Object.prototype).sort().join();
const protoBefore = protoKeys();

/** The fuzz rule for one model text: refused, or loaded and forecasting finite numbers. */
function checkModelText(text: string): 'refused' | 'refused at forecast' | 'forecast' {
  const loaded = outcome(() => learnerFromStored(parseStoredModel(text, 'fuzz.json'), 'fuzz.json'));
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  expect(protoKeys()).toBe(protoBefore);
  if (!loaded.ok) return 'refused';
  const stored = parseStoredModel(text);
  const result = outcome(() => forecastAhead(loaded.value, series, stored.setup.drivers));
  if (!result.ok) return 'refused at forecast';
  const { rows } = result.value;
  expect(rows.length).toBeGreaterThan(0);
  // a band may be unknown (both ends NaN, too few stored errors); a forecast may not
  const bandOk = (r: typeof rows[number]) => (Number.isNaN(r.lower) && Number.isNaN(r.upper)) || (Number.isFinite(r.lower) && Number.isFinite(r.upper) && r.lower <= r.upper);
  const bad = rows.find((r) => !Number.isFinite(r.forecast) || !bandOk(r));
  expect(bad, `a loaded model forecast ${JSON.stringify(bad)}`).toBeUndefined();
  return 'forecast';
}

// ---- mutations of a valid file -------------------------------------------------------------

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Path = (string | number)[];

function paths(v: Json, at: Path = [], out: Path[] = []): Path[] {
  out.push(at);
  if (Array.isArray(v)) v.forEach((x, i) => paths(x, [...at, i], out));
  else if (v && typeof v === 'object') for (const k of Object.keys(v)) paths(v[k], [...at, k], out);
  return out;
}

function getAt(root: Json, path: Path): Json {
  return path.reduce<Json>((v, k) => (v as Record<string, Json>)[k as string], root);
}

const f32 = (xs: number[]) => encodeFloats(xs, 4);
const f64 = (xs: number[]) => encodeFloats(xs, 8);

/** A replacement for one value, chosen knowing the value it replaces. */
function replacement(old: Json, pick: number, junk: Json): Json {
  if (typeof old === 'number') return [old + 1, old - 1, -old, old * 2, old * 1e6, 0, 0.5, 1e308, -1e308, 2 ** 31, 4096, 4097, 10_000_000, junk][pick % 14];
  if (typeof old === 'string' && /^[A-Za-z0-9+/]+={0,2}$/.test(old) && old.length >= 8) {
    const n32 = (old.length / 4) * 3 / 4 | 0;
    return [
      old.slice(4), `${old}AAAA`, old.replace(/[A-Z]/, 'z'), `${old.slice(0, -2)}!!`,
      f32(new Array(n32).fill(NaN)), f32(new Array(n32).fill(Infinity)), f32(new Array(n32).fill(3e38)), f32(new Array(n32).fill(-3e38)),
      f64(new Array(Math.max(1, n32 >> 1)).fill(1e300)), f64(new Array(Math.max(1, n32 >> 1)).fill(0)), f32(new Array(n32).fill(0)), '', junk,
    ][pick % 13];
  }
  if (typeof old === 'string') return [old.slice(1), `${old}x`, '__proto__', 'x'.repeat(70_000), '', 'Europe/Nowhere', '9999-99-99', 'linear', 'neural', 'blend', 'constructor', junk][pick % 12];
  if (Array.isArray(old)) return [[], [...old, ...old], old.slice(1), old.slice(0, -1), [...old].reverse(), new Array(5000).fill(old[0] ?? 0), junk][pick % 7];
  if (old && typeof old === 'object') return [{}, { ...old, extra: 1 }, JSON.parse('{"__proto__": {"polluted": true}}'), junk][pick % 4];
  return junk;
}

const mutation = fc.record({
  kind: fc.constantFrom('blend', 'linear', 'neural'),
  edits: fc.array(fc.record({ path: fc.nat(), op: fc.constantFrom('replace', 'replace', 'replace', 'delete', 'add'), pick: fc.nat(), junk: fc.jsonValue({ maxDepth: 2 }) as fc.Arbitrary<Json> }), { minLength: 1, maxLength: 3 }),
});

function mutate(text: string, edits: { path: number; op: string; pick: number; junk: Json }[]): string {
  const root = JSON.parse(text) as Json;
  for (const e of edits) {
    const all = paths(root).filter((p) => p.length > 0);
    const path = all[e.path % all.length];
    const parent = getAt(root, path.slice(0, -1)) as Record<string, Json> | Json[];
    const key = path[path.length - 1];
    if (e.op === 'delete') {
      if (Array.isArray(parent)) parent.splice(key as number, 1);
      else delete parent[key as string];
    } else if (e.op === 'add' && !Array.isArray(parent)) {
      parent[['extra', '__proto__', 'constructor', 'toString', 'x'.repeat(65)][e.pick % 5]] = e.junk;
    } else {
      (parent as Record<string, Json>)[key as string] = replacement((parent as Record<string, Json>)[key as string], e.pick, e.junk);
    }
  }
  return JSON.stringify(root);
}

describe('parseStoredModel + learnerFromStored on untrusted text', () => {
  it('the unmutated files load and forecast finite numbers (else the mutations test nothing)', () => {
    for (const kind of Object.keys(files)) expect(checkModelText(files[kind])).toBe('forecast');
  });

  it('refuse random JSON values and random text with an InputError', () => {
    const text = fc.oneof(
      fc.json({ maxDepth: 4 }),
      fc.string({ unit: 'binary', maxLength: 200 }),
      fc.constantFrom('', ' ', 'null', '[]', '{}', '"x"', '1e999', '{"__proto__":{"polluted":true}}', '{"format":"spotloom-model","version":1}', '\uFEFF{}'),
      fc.jsonValue().map((v) => JSON.stringify({ format: 'spotloom-model', version: 1, name: v })),
    );
    fc.assert(fc.property(text, (t) => { expect(checkModelText(t)).toBe('refused'); }), params(1000, 61));
  });

  it('refuse each mutation of a valid file with an InputError, or load a model that forecasts finite numbers', () => {
    const seen: Record<string, number> = {};
    fc.assert(fc.property(mutation, ({ kind, edits }) => {
      const r = checkModelText(mutate(files[kind], edits));
      seen[r] = (seen[r] ?? 0) + 1;
    }), params(600, 62));
    // both branches are exercised (harmless edits such as a new name or note load and forecast)
    expect(seen.refused).toBeGreaterThan(0);
    expect(seen.forecast).toBeGreaterThan(0);
  });

  it('refuse text-level damage: flipped characters, cut files, duplicated keys, more than 2 MB', () => {
    const damage = fc.record({ kind: fc.constantFrom('blend', 'linear'), at: fc.nat(), len: fc.nat(40), insert: fc.string({ maxLength: 8 }) });
    fc.assert(fc.property(damage, ({ kind, at, len, insert }) => {
      const t = files[kind];
      const i = at % t.length;
      checkModelText(t.slice(0, i) + insert + t.slice(i + len));
    }), params(500, 63));
    const big = files.blend.replace('"notes":[', `"notes":[${'"x",'.repeat(Math.ceil(MAX_MODEL_BYTES / 4))}`);
    expect(checkModelText(big)).toBe('refused');
    expect(checkModelText(files.blend.replace('{"format"', '{"__proto__":{"polluted":true},"format"'))).toBe('refused');
    expect(checkModelText(files.linear.replace('"version":1', '"version":1,"version":1'))).toBe('forecast'); // JSON.parse keeps the last
  });
});

describe('extreme stored statistics never reach a forecast', () => {
  // A linear model file with setup.driverStats[0].mean = 1e300 loads (the schema asks only for a
  // finite number); it used to forecast -Infinity for every hour and is now refused at forecast.
  it('a model with driverStats[0].mean = 1e300 is refused or forecasts finite numbers', () => {
    const m = JSON.parse(files.linear);
    m.setup.driverStats[0].mean = 1e300;
    const loaded = learnerFromStored(parseStoredModel(JSON.stringify(m)));
    const r = outcome(() => forecastAhead(loaded, series, m.setup.drivers));
    if (r.ok) for (const row of r.value.rows) expect(Number.isFinite(row.forecast)).toBe(true);
  });
});
