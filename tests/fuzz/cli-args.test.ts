import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main';
import { createModel, inputFrame, type Learner, storedModelText, toStoredModel } from '../../src/engine';
import { syntheticSeries } from '../support/synthetic';
import { params, SCALE, SEED } from './support';

/**
 * The command line with random flags and values. Every run must end with
 * exit code 0 or 2 (never 1, an internal fault), print no stack trace and,
 * on exit 2, say what is wrong. Most cases call main() in this process
 * (fast); a few spawn `node bin/spotloom.mjs` as a user would, in a scratch
 * folder so that no relative --out or --save lands in the repository.
 * SPOTLOOM_FUZZ_SPAWNS sets how many are spawned (npm run fuzz raises it).
 */

const BIN = join(__dirname, '..', '..', 'bin', 'spotloom.mjs');
const SPAWNS = Number(process.env.SPOTLOOM_FUZZ_SPAWNS ?? 6);
const STACK = /^\s+at\s.*[:(]\d+/m;

let dir = '';
const file: Record<string, string> = {};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'spotloom-fuzz-cli-'));
  const series = syntheticSeries(120);
  // a short price file (too short to train on), a long one, a score file, a model, junk
  const rows = (n: number) => ['timestamp,price,load_forecast', ...series.times.slice(0, n).map((t, i) => `${new Date(t).toISOString()},${series.price[i]},${series.drivers.load_forecast[i]}`)].join('\n');
  file.short = join(dir, 'short.csv');
  writeFileSync(file.short, rows(24 * 12));
  file.long = join(dir, 'long.csv');
  writeFileSync(file.long, `${rows(series.times.length - 24)}\n${series.times.slice(-24).map((t, i) => `${new Date(t).toISOString()},,${series.drivers.load_forecast[series.times.length - 24 + i]}`).join('\n')}`);
  file.score = join(dir, 'score.csv');
  writeFileSync(file.score, ['timestamp,actual,ours,theirs', ...series.times.slice(0, 24 * 9).map((t, i) => `${new Date(t).toISOString()},${series.price[i]},${(series.price[i] + Math.sin(i)).toFixed(2)},${series.price[Math.max(0, i - 24)]}`)].join('\n'));
  const model = createModel('linear', { seed: 1 }) as Learner;
  model.fit(inputFrame({ ...series, times: series.times.slice(0, -24), price: series.price.slice(0, -24), drivers: { load_forecast: series.drivers.load_forecast.slice(0, -24) } }));
  file.model = join(dir, 'model.json');
  writeFileSync(file.model, storedModelText(toStoredModel(model, { name: 'fuzz', zone: series.zone, resolution: 60 })));
  // the daily files: history without the forecast day, that day's drivers (;, decimal commas), an issued forecast and prices
  file.history = join(dir, 'history.csv');
  writeFileSync(file.history, rows(series.times.length - 24));
  const last = series.times.slice(-24);
  file.drivers = join(dir, 'drivers.csv');
  writeFileSync(file.drivers, ['timestamp;load_forecast', ...last.map((t, i) => `${new Date(t).toISOString()};${String(series.drivers.load_forecast[series.times.length - 24 + i]).replace('.', ',')}`)].join('\n'));
  file.issued = join(dir, 'issued.csv');
  writeFileSync(file.issued, ['timestamp,forecast,lower,upper', ...series.times.slice(0, 48).map((t, i) => `${new Date(t).toISOString()},${series.price[i] + 1},${series.price[i] - 5},${series.price[i] + 5}`)].join('\n'));
  file.junk = join(dir, 'junk.csv');
  writeFileSync(file.junk, '\u0000\u0001garbage,"\n');
  file.folder = join(dir, 'folder');
  mkdirSync(file.folder);
  mkdirSync(join(dir, 'w'));
  file.missing = join(dir, 'missing.csv');
}, 60_000);

const FLAGS = [
  '--input', '--test-start', '--test-end', '--model', '--retrain-every', '--tz', '--region', '--seed', '--out', '--json',
  '--until', '--save', '--against', '--season', '--hidden', '--learning-rate', '--momentum', '--iterations', '--ensemble',
  '--features', '--coverage', '--help', '--version', '-h', '--bogus', '-x', '--', '---', '--input=',
  '--drivers', '--actuals', '--delimiter', '--decimal',
];

/** A value token; files are named by key and resolved in the scratch folder. */
const value = fc.oneof(
  fc.constantFrom('@short', '@long', '@score', '@model', '@junk', '@folder', '@missing', '@out', '@save', '@history', '@drivers', '@issued'),
  fc.constantFrom('2025-01-20', '2025-03-30', '2025-05-01', '2025-01-05', '1999-01-01', '2099-12-31', '2025-02-30', '2025-1-1', 'tomorrow'),
  fc.constantFrom('0', '1', '-1', '1.5', '7', '1e999', 'NaN', '', ' ', '99999999999', '0.9', '1,2', '5,abc', '0x10', '-0'),
  fc.constantFrom('blend', 'neural', 'linear', 'naive-day', 'naive-week', 'weekday-rule', 'oracle', 'Europe/Berlin', 'UTC', 'Mars/Base', 'DE', 'DE-BY', 'ZZ', 'price_lags,weekday', 'ours', 'theirs', 'actual'),
  fc.string({ unit: 'grapheme', maxLength: 12 }),
  fc.constantFrom('x'.repeat(3000), 'line\nbreak', '--json', '-', '\u202e', '%s%n', '$(echo hi)'),
);

/** Mostly well-formed values per flag, so that runs get past the option checks into the engine. */
const GOOD: Record<string, string[]> = {
  '--input': ['@short', '@long', '@long', '@score', '@junk', '@missing', '@folder', '@history', '@issued'],
  '--test-start': ['2025-04-10', '2025-04-28', '2025-01-12', '2025-01-06', '2025-05-03', '2024-12-01', '2025-06-01'],
  '--test-end': ['2025-04-20', '2025-05-02', '2025-01-01'],
  '--until': ['2025-04-20', '2025-03-01', '2025-01-06', '2030-01-01'],
  '--model': ['naive-day', 'naive-week', 'weekday-rule', 'linear', 'blend', 'neural', '@model'],
  '--retrain-every': ['0', '1', '3'],
  '--tz': ['Europe/Berlin', 'UTC', 'Asia/Kolkata', 'America/New_York'],
  '--region': ['DE', 'DE-BY', 'FR', 'US'],
  '--seed': ['1', '42', '0'],
  '--save': ['@save'], '--out': ['@out'],
  '--against': ['theirs', 'ours', 'THEIRS', 'nope'],
  '--season': ['24', '168', '1'],
  '--hidden': ['4', '3,2'], '--learning-rate': ['0.05', '0.3'], '--momentum': ['0', '0.5'],
  '--iterations': ['2', '3'], '--ensemble': ['1', '2'], '--features': ['price_lags,weekday', 'price_lags', 'drivers_target,price_lags'],
  '--coverage': ['0.8', '0.9'],
  '--drivers': ['@drivers', '@drivers', '@short', '@junk', '@missing'],
  '--actuals': ['@short', '@long', '@history', '@junk'],
  '--delimiter': [',', ';', 'tab', '|'],
  '--decimal': ['.', ',', ',', 'x'],
};
const MODEL_FLAGS = ['--region', '--seed', '--hidden', '--learning-rate', '--momentum', '--iterations', '--ensemble', '--features', '--coverage'];
const OWN: Record<string, string[]> = {
  backtest: ['--test-end', '--retrain-every', '--tz', '--out', '--json', ...MODEL_FLAGS],
  train: ['--until', '--tz', '--json', ...MODEL_FLAGS],
  forecast: ['--out', '--json', '--drivers', '--drivers', '--delimiter', '--decimal'],
  score: ['--season', '--tz', '--json', '--actuals', '--delimiter', '--decimal'],
};
const REQUIRED: Record<string, string[]> = {
  backtest: ['--input', '--test-start', '--model'], train: ['--input', '--save', '--model'],
  forecast: ['--model', '--input'], score: ['--input', '--against'],
};

const argv = fc.record({
  command: fc.oneof({ weight: 12, arbitrary: fc.constantFrom('backtest', 'train', 'forecast', 'score') }, { weight: 1, arbitrary: fc.constantFrom('demo', 'help', '', 'BACKTEST', 'serve', '--help', '--version') }),
  keep: fc.array(fc.noBias(fc.integer({ min: 0, max: 99 })), { minLength: 3, maxLength: 3 }),
  picks: fc.array(fc.nat(), { minLength: 3, maxLength: 3 }),
  wild: fc.array(value, { minLength: 3, maxLength: 3 }),
  extra: fc.array(fc.tuple(fc.nat(), fc.option(value, { freq: 4 }), fc.noBias(fc.nat(9)), fc.nat()), { maxLength: 3 }),
  stray: fc.oneof({ weight: 8, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: value }),
}).map(({ command, keep, picks, wild, extra, stray }) => {
  const args: string[] = command === '' ? [] : [command];
  (REQUIRED[command] ?? []).forEach((flag, i) => {
    if (keep[i] < 8) return; // a required flag left out
    const good = command === 'forecast' && flag === '--model' ? ['@model', '@model', '@junk', '@short']
      : command === 'train' && flag === '--model' ? ['linear', 'linear', 'blend', 'neural', 'naive-day']
        : command === 'score' && flag === '--input' ? ['@score', '@score', '@short', '@issued'] : GOOD[flag];
    args.push(flag, keep[i] < 20 ? wild[i] : good[picks[i] % good.length]);
  });
  for (const [which, v, kind, pick] of extra) {
    // mostly a flag of this command with a well-formed value, now and then any flag with any value
    const own = OWN[command] ?? FLAGS;
    const flag = kind < 7 ? own[which % own.length] : FLAGS[which % FLAGS.length];
    const val = kind < 5 && GOOD[flag] ? GOOD[flag][pick % GOOD[flag].length] : flag === '--json' && kind < 7 ? null : v;
    if (val === null) args.push(flag);
    else if (pick % 5 === 0 && flag.startsWith('--')) args.push(`${flag}=${val}`);
    else args.push(flag, val);
  }
  // learned models on the long file train for real: keep them small (the last flag wins)
  if ((command === 'backtest' || command === 'train') && args.includes('@long') && ['blend', 'neural'].some((m) => args.includes(m))) {
    args.push('--iterations', '2', '--ensemble', '1', '--hidden', '3');
  }
  return stray === null ? args : [...args, stray];
});

/** Resolves @names to scratch files; `demo` only ever writes into the scratch folder and, unless asking for help, is left out (slow). */
function resolve(args: string[], n: number): string[] | undefined {
  const out = args.map((a) => a.replace(/^(--[a-z-]+=)?@(\w+)$/, (_m, pre = '', key: string) =>
    pre + (key === 'out' ? join(dir, `out-${n}.csv`) : key === 'save' ? join(dir, `save-${n}.json`) : file[key])));
  if (out[0] === 'demo' && !out.some((a) => a === '--help' || a === '-h' || a.startsWith('--bogus'))) return undefined;
  // a value that is a bare relative path would be written relative to the test's folder: keep --out and --save in scratch
  for (let i = 0; i < out.length; i++) {
    const m = /^--(out|save)(=(.*))?$/.exec(out[i]);
    if (!m) continue;
    const safe = (v: string) => (v.startsWith(dir) ? v : join(dir, 'w', encodeURIComponent(v).slice(0, 80) || 'empty'));
    if (m[2] !== undefined) out[i] = `--${m[1]}=${safe(m[3])}`;
    else if (i + 1 < out.length) out[i + 1] = safe(out[i + 1]);
  }
  return out;
}

function expectClean(status: number | null, stderr: string, args: string[]) {
  const shown = JSON.stringify(args).slice(0, 300);
  expect([0, 2], `exit ${status} for ${shown}\n${stderr.slice(0, 500)}`).toContain(status);
  expect(stderr, `stack trace for ${shown}`).not.toMatch(STACK);
  expect(stderr).not.toMatch(/internal error/);
  if (status === 2) expect(stderr.trim().length, `exit 2 without a message for ${shown}`).toBeGreaterThan(0);
}

async function inProcess(args: string[]) {
  let stderr = '';
  const out = process.stdout.write, err = process.stderr.write;
  process.stdout.write = (() => true) as never;
  process.stderr.write = ((s: string | Uint8Array) => { stderr += String(s); return true; }) as never;
  try {
    return { status: await main(args), stderr };
  } finally {
    process.stdout.write = out;
    process.stderr.write = err;
  }
}

function spawned(args: string[]): Promise<{ status: number | null; stderr: string }> {
  return new Promise((done) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd: dir, env: { ...process.env, SPOTLOOM_DEBUG: '' } });
    let stderr = '';
    child.stderr.on('data', (b) => { stderr += b; });
    child.stdout.resume();
    const timer = setTimeout(() => child.kill('SIGKILL'), 120_000);
    child.on('close', (status) => { clearTimeout(timer); done({ status, stderr }); });
  });
}

describe('spotloom with random flags and values', () => {
  it('main(argv) exits 0 or 2 and prints no stack trace', async () => {
    let n = 0;
    await fc.assert(fc.asyncProperty(argv, async (raw) => {
      const args = resolve(raw, n++);
      if (!args) return;
      const { status, stderr } = await inProcess(args);
      expectClean(status, stderr, args);
    }), params(150, 71));
  }, 300_000);

  it(`node bin/spotloom.mjs exits 0 or 2 and prints no stack trace (${SPAWNS} spawned runs)`, async () => {
    const cases = fc.sample(argv, { seed: SEED + 72, numRuns: SPAWNS * 3 }).map((a, i) => resolve(a, 10_000 + i)).filter((a): a is string[] => !!a).slice(0, Math.round(SPAWNS));
    const results: { args: string[]; status: number | null; stderr: string }[] = [];
    const queue = [...cases];
    await Promise.all(Array.from({ length: 3 }, async () => {
      for (let args = queue.shift(); args; args = queue.shift()) results.push({ args, ...(await spawned(args)) });
    }));
    for (const r of results) expectClean(r.status, r.stderr, r.args);
    expect(results.length).toBe(cases.length);
  }, 600_000 * Math.max(1, SCALE));
});
