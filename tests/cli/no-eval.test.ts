import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { syntheticSeries } from '../support/synthetic';
import { scratch } from './run-cli';

/**
 * The command line with code generation from strings switched off in V8
 * (no eval, no new Function): train, forecast and backtest must still work,
 * for the linear model and for the network blend. A control run shows that
 * the switch is really on in the child processes.
 */

const BIN = join(__dirname, '..', '..', 'bin', 'spotloom.mjs');
const NO_EVAL = { NODE_OPTIONS: '--disallow-code-generation-from-strings' };

function run(args: string[], env: NodeJS.ProcessEnv = NO_EVAL): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((done) => {
    const child = spawn(process.execPath, args, { env: { ...process.env, ...env } });
    let stdout = '', stderr = '';
    child.stdout.on('data', (b) => { stdout += b; });
    child.stderr.on('data', (b) => { stderr += b; });
    child.on('close', (status) => done({ status, stdout, stderr }));
  });
}
const cli = (args: string[]) => run([BIN, ...args]);

let dir = '';
let history = '';
let open = '';
let lastDay = '';

beforeAll(() => {
  dir = scratch();
  // 120 days of hourly prices with a load forecast (Europe/Berlin); for `forecast`, the
  // rows of the last whole local day keep their load forecast but lose their price
  const s = syntheticSeries(120);
  const end = s.times.findIndex((t) => t >= Date.parse('2025-05-05T00:00:00+02:00'));
  const openFrom = s.times.findIndex((t) => t >= Date.parse('2025-05-04T00:00:00+02:00'));
  lastDay = '2025-05-04';
  const line = (i: number, price: boolean) => `${new Date(s.times[i]).toISOString()},${price ? s.price[i].toFixed(3) : ''},${s.drivers.load_forecast[i].toFixed(2)}`;
  const rows = (priceUntil: number) => ['timestamp,price,load_forecast', ...Array.from({ length: end }, (_, i) => line(i, i < priceUntil))].join('\n');
  history = join(dir, 'history.csv');
  writeFileSync(history, rows(end));
  open = join(dir, 'open.csv');
  writeFileSync(open, rows(openFrom));
});

describe('spotloom under NODE_OPTIONS=--disallow-code-generation-from-strings', () => {
  it('the switch is on in a child process: new Function fails there', async () => {
    const r = await run(['-e', 'new Function("return 1")()']);
    expect(r.status).not.toBe(0);
    expect(r.stderr).toMatch(/EvalError|Code generation from strings disallowed/);
  });

  it('train, forecast and backtest work for --model linear and --model blend --ensemble 1 --iterations 5', async () => {
    const lin = join(dir, 'linear.json'), blend = join(dir, 'blend.json');
    const [trainLin, trainBlend] = await Promise.all([
      cli(['train', '--input', history, '--until', lastDay, '--save', lin, '--model', 'linear', '--json']),
      cli(['train', '--input', history, '--until', lastDay, '--save', blend, '--model', 'blend', '--ensemble', '1', '--iterations', '5', '--json']),
    ]);
    for (const r of [trainLin, trainBlend]) {
      expect(r.stderr).not.toMatch(/EvalError|Code generation|internal error/);
      expect(r.status, r.stderr).toBe(0);
    }
    expect(JSON.parse(trainLin.stdout).model).toBe('linear');
    expect(JSON.parse(trainBlend.stdout).model).toBe('blend');

    const [fLin, fBlend, bLin, bBlend] = await Promise.all([
      cli(['forecast', '--model', lin, '--input', open, '--json']),
      cli(['forecast', '--model', blend, '--input', open, '--json']),
      cli(['backtest', '--input', history, '--test-start', '2025-04-28', '--model', 'linear', '--json']),
      cli(['backtest', '--input', history, '--test-start', '2025-04-28', '--model', 'blend', '--ensemble', '1', '--iterations', '5', '--json']),
    ]);
    for (const r of [fLin, fBlend, bLin, bBlend]) {
      expect(r.stderr).not.toMatch(/EvalError|Code generation|internal error/);
      expect(r.status, r.stderr).toBe(0);
    }
    for (const r of [fLin, fBlend]) {
      const out = JSON.parse(r.stdout);
      expect(out.days).toEqual([lastDay]);
      expect(out.rows).toHaveLength(24);
      for (const row of out.rows) for (const v of [row.forecast, row.lower, row.upper]) expect(Number.isFinite(v)).toBe(true);
    }
    for (const r of [bLin, bBlend]) {
      const summary = JSON.parse(r.stdout.trim().split('\n').pop()!);
      expect(summary.days).toBe(7);
      expect(Number.isFinite(summary.mae)).toBe(true);
      expect(Number.isFinite(summary.rmae)).toBe(true);
    }
  }, 300_000);
});
