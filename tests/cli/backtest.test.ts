import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli, scratch, writeFile } from './run-cli';

// 30 local days of hourly prices in Europe/Berlin from 2025-03-10, across the spring change.
function file(dir: string): string {
  const rows = ['timestamp,price,temperature_forecast'];
  const t0 = Date.parse('2025-03-09T23:00:00Z');
  for (let k = 0; k < 30 * 24 - 1; k++) rows.push(`${new Date(t0 + k * 3_600_000).toISOString()},${(40 + 9 * Math.sin(k / 4)).toFixed(2)},${(k % 13) - 2}`);
  return writeFile(dir, 'prices.csv', rows.join('\n') + '\n');
}

describe('spotloom backtest', () => {
  it('--model naive-week --json --out writes the contract columns and summary keys', () => {
    const dir = scratch();
    const out = join(dir, 'out.csv');
    const r = runCli(['backtest', '--input', file(dir), '--test-start', '2025-03-31', '--model', 'naive-week', '--json', '--out', out]);
    expect(r.status).toBe(0);
    const summary = JSON.parse(r.stdout.trim().split('\n').pop()!);
    for (const k of ['model', 'mae', 'rmse', 'smape', 'rmae', 'periods', 'seconds']) expect(summary).toHaveProperty(k);
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    expect(lines[0]).toBe('timestamp,forecast,lower,upper,actual');
    expect(lines.length - 1).toBe(summary.periods);
    expect(lines[1]).toMatch(/^2025-03-31T00:00:00\+02:00,[\d.]+,,,[\d.]+$/);
    expect(r.stderr).toMatch(/daylight-saving days: 2025-03-30 \(23\)/);
  });

  it.each([
    ['empty.csv', 'timestamp,price\n', /no data rows/],
    ['text.csv', 'timestamp,price\n2025-03-01T00:00:00+01:00,abc\n', /text\.csv: row 2, column "price"/],
    ['dup.csv', 'timestamp,price\n2025-03-01T00:00:00+01:00,3\n2025-03-01T00:00:00+01:00,4\n', /appears twice/],
    ['noheader.csv', '2025-03-01T00:00:00+01:00,3\n', /no "timestamp" column/],
  ])('%s exits 2 with one line and no stack trace', (name, text, message) => {
    const dir = scratch();
    const r = runCli(['backtest', '--input', writeFile(dir, name, text), '--test-start', '2025-03-01', '--model', 'naive-week']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/^\s+at .*:\d+/m);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('exits 2 for a test start outside the data, a missing file and a bad option', () => {
    const dir = scratch();
    const f = file(dir);
    expect(runCli(['backtest', '--input', f, '--test-start', '2031-01-01', '--model', 'naive-week']).status).toBe(2);
    expect(runCli(['backtest', '--input', join(dir, 'nope.csv'), '--test-start', '2025-03-31']).stderr).toMatch(/nope\.csv: no such file/);
    expect(runCli(['backtest', '--input', f, '--test-start', '2025-03-31', '--model', 'oracle']).status).toBe(2);
    expect(runCli(['backtest', '--input', f, '--test-start', '2025-03-31', '--retrain-every', 'x', '--model', 'naive-day']).stderr).toMatch(/--retrain-every must be a whole number/);
  });

  it('--missing fail refuses a history with a missing price; the default fills it and says so', () => {
    const dir = scratch();
    const lines = readFileSync(file(dir), 'utf8').split('\n');
    lines[100] = lines[100].replace(/,[\d.]+,/, ',,');
    const f = writeFile(dir, 'gappy.csv', lines.join('\n'));
    const fail = runCli(['backtest', '--input', f, '--test-start', '2025-03-31', '--model', 'naive-week', '--missing', 'fail']);
    expect(fail.status).toBe(2);
    expect(fail.stderr).toMatch(/1 period inside the history has no price, the first at 2025-03-14T03:00:00\+01:00/);
    const fill = runCli(['backtest', '--input', f, '--test-start', '2025-03-31', '--model', 'naive-week']);
    expect(fill.status).toBe(0);
    expect(fill.stderr).toMatch(/1 period has no price; model inputs take the same period of the nearest earlier day/);
  });
  it('--model lear backtests from 28 days of history and refuses fewer, naming the days it needs', () => {
    const dir = scratch();
    const f = file(dir);
    const r = runCli(['backtest', '--input', f, '--test-start', '2025-04-07', '--model', 'lear', '--json']);
    expect(r.status).toBe(0);
    const summary = JSON.parse(r.stdout.trim().split('\n').pop()!);
    expect(summary.model).toBe('lear');
    expect(summary.retrain_every).toBe(1);
    expect(summary.periods).toBeGreaterThan(24);
    expect(Number.isFinite(summary.mae)).toBe(true);
    const short = runCli(['backtest', '--input', f, '--test-start', '2025-03-31', '--model', 'lear']);
    expect(short.status).toBe(2);
    expect(short.stderr.trim()).toMatch(/--test-start 2025-03-31 leaves 21 days of history before it; model lear needs at least 28$/);
    expect(short.stderr).not.toMatch(/^\s+at .*:\d+/m);
  });
});
