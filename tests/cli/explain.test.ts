import { beforeAll, describe, expect, it } from 'vitest';
import { dailyFiles } from './dialect-files';
import { runMain } from './in-process';
import { runCli, scratch } from './run-cli';

/**
 * spotloom explain on the invented dialect file (tests/cli/dialect-files.ts):
 * history to 2025-10-25, tomorrow the 25-hour 2025-10-26 (Directive
 * 2000/84/EC), its drivers in a file of their own in a continental dialect.
 */
const dir = scratch();
const { historyFile, oneFile, driversFile, model } = dailyFiles(dir);

async function explain(args: string[]) {
  const r = await runMain(['explain', '--model', model, ...args]);
  expect(r.status, r.stderr).toBe(0);
  return r;
}
const json = async (args: string[]) => JSON.parse((await explain([...args, '--json'])).stdout.trim());

beforeAll(async () => {
  const trained = await runMain(['train', '--input', historyFile, '--model', 'linear', '--save', model]);
  expect(trained.status, trained.stderr).toBe(0);
}, 120_000);

describe('spotloom explain --model M --input FILE [--drivers FILE] [--against d-1|d-7] [--json]', () => {
  it('--json has the fields of design.md, and the contributions add up to the change of the mean forecast', async () => {
    const e = await json(['--input', historyFile, '--drivers', driversFile]);
    expect(e).toMatchObject({ day: '2025-10-26', reference_day: '2025-10-25', against: 'd-1', model: 'linear' });
    for (const k of ['forecast_mean', 'reference_forecast_mean', 'reference_actual_mean', 'change']) expect(typeof e[k], k).toBe('number');
    expect(e.change).toBe(e.forecast_mean - e.reference_forecast_mean);
    const sum = e.contributions.reduce((s: number, c: { value: number }) => s + c.value, 0);
    expect(Math.abs(sum - e.change)).toBeLessThanOrEqual(1e-9 * Math.abs(e.change));
    expect(e.contributions.map((c: { group: string }) => c.group)).toContain('drivers_target');
    expect(e.forecast_per_slot).toHaveLength(24);
  });

  it('--drivers gives the same explanation as the one-file form, and its forecast is the one forecast issues (per clock slot)', async () => {
    const two = await json(['--input', historyFile, '--drivers', driversFile]);
    const one = await json(['--input', oneFile]);
    expect(two).toEqual(one);
    const f = await runMain(['forecast', '--model', model, '--input', oneFile, '--json']);
    const rows: { forecast: number }[] = JSON.parse(f.stdout).rows;
    expect(rows).toHaveLength(25);
    // the repeated hour's two periods share one clock slot: the 25 forecasts are the 24 slot values
    expect([...new Set(rows.map((r) => r.forecast))].sort()).toEqual([...two.forecast_per_slot].sort());
  });

  it('--against d-7 compares with the same weekday a week before: the weekday group gives exactly 0', async () => {
    const e = await json(['--input', oneFile, '--against', 'd-7']);
    expect(e.reference_day).toBe('2025-10-19');
    expect(e.contributions.find((c: { group: string }) => c.group === 'weekday').value).toBe(0);
  });

  it('prints a readable table by default: the reference day, the forecast, groups largest first with the price unit, and the sum', async () => {
    const { stdout } = await explain(['--input', oneFile]);
    const e = await json(['--input', oneFile]);
    expect(stdout).toContain(`2025-10-25 (d-1): actual mean ${e.reference_actual_mean.toFixed(2)}; the model said ${e.reference_forecast_mean.toFixed(2)}`);
    expect(stdout).toContain(`2025-10-26: forecast mean ${e.forecast_mean.toFixed(2)}`);
    expect(stdout).toMatch(/input group\s+contribution \(currency\/MWh\)/);
    const table = stdout.split('\n').filter((l) => /^[a-z_0-9]+\s+[+-]\d+\.\d\d$/.test(l) && !l.startsWith('sum'));
    expect(table).toHaveLength(e.contributions.length);
    const values = table.map((l) => Math.abs(Number(l.trim().split(/\s+/)[1])));
    expect(values).toEqual([...values].sort((a, b) => b - a));
    expect(stdout).toMatch(new RegExp(`sum\\s+[+]?${e.change.toFixed(2).replace('+', '')}`));
  });

  it('--sensitivity adds the forecast change per unit of each driver', async () => {
    const e = await json(['--input', oneFile, '--sensitivity']);
    expect(e.sensitivity.map((s: { driver: string }) => s.driver)).toEqual(['load_forecast', 'wind_forecast']);
    for (const s of e.sensitivity) expect(s.per_slot).toHaveLength(24);
  });

  it('bad input: exit 2 with one line, no stack trace (child process)', () => {
    const wrongZone = runCli(['explain', '--model', model, '--input', oneFile, '--tz', 'Europe/London']);
    expect(wrongZone.status).toBe(2);
    expect(wrongZone.stderr.trim()).toBe('spotloom: --tz Europe/London differs from the zone the model was trained in (Europe/Berlin); leave --tz out or train the model in that zone');
    const noDrivers = runCli(['explain', '--model', model, '--input', historyFile]);
    expect(noDrivers.status).toBe(2);
    expect(noDrivers.stderr).toMatch(/spotloom: the forecast for 2025-10-26 needs its rows/);
    expect(noDrivers.stderr).not.toMatch(/\n\s+at /);
    const against = runCli(['explain', '--model', model, '--input', oneFile, '--against', 'd-2']);
    expect(against.status).toBe(2);
  }, 120_000);
});
