import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { syntheticSeries } from '../support/synthetic';
import { runCli, scratch, writeFile } from './run-cli';

describe('spotloom train with a driver column the model file cannot name', () => {
  it('exits 2 before training, naming the column (a bad name used to fail only after training, without saying which)', () => {
    const dir = scratch();
    const s = syntheticSeries(100);
    const bad = `load ${'x'.repeat(70)}`;
    const rows = [`timestamp,price,${bad}`, ...s.times.map((t, i) => `${new Date(t).toISOString()},${s.price[i]},${s.drivers.load_forecast[i]}`)];
    const save = join(dir, 'm.json');
    const r = runCli(['train', '--input', writeFile(dir, 'odd.csv', rows.join('\n')), '--save', save, '--model', 'linear']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(`odd.csv: column "${bad}" cannot be a driver name in a model file`);
    expect(r.stderr).not.toMatch(/^train: /m); // no training progress: refused first
    expect(existsSync(save)).toBe(false);
  });

  it('keeps a header with a unit such as "load (MW)" as a driver name', () => {
    const dir = scratch();
    const s = syntheticSeries(180);
    const rows = ['timestamp,price,load (MW)', ...s.times.map((t, i) => `${new Date(t).toISOString()},${s.price[i]},${s.drivers.load_forecast[i]}`)];
    const save = join(dir, 'm.json');
    const r = runCli(['train', '--input', writeFile(dir, 'units.csv', rows.join('\n')), '--save', save, '--model', 'linear', '--json']);
    expect(r.status).toBe(0);
    expect(JSON.parse(readFileSync(save, 'utf8')).setup.drivers).toEqual(['load (MW)']);
  });
});
