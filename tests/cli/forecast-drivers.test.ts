import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { forecastCommand } from '../../src/cli/commands/forecast';
import { dailyFiles } from './dialect-files';
import { runMain } from './in-process';
import { scratch, writeFile } from './run-cli';

/**
 * The daily way: history in one file, the forecast day's driver forecasts in
 * another. The forecast day is the 25-hour 2025-10-26 (Directive 2000/84/EC).
 */
const dir = scratch();
const { historyFile, oneFile, driversFile, model } = dailyFiles(dir);

async function forecast(args: string[]) {
  const r = await runMain(['forecast', '--model', model, ...args, '--json']);
  expect(r.status, r.stderr).toBe(0);
  return { json: JSON.parse(r.stdout.trim()), stderr: r.stderr };
}

describe('spotloom forecast --drivers FILE', () => {
  it('gives the same forecast as the one-file form, bit for bit (25 periods of 2025-10-26)', async () => {
    const trained = await runMain(['train', '--input', historyFile, '--model', 'linear', '--save', model]);
    expect(trained.status, trained.stderr).toBe(0);
    const one = await forecast(['--input', oneFile]);
    const two = await forecast(['--input', historyFile, '--drivers', driversFile]);
    expect(two.json.rows).toEqual(one.json.rows);
    expect(two.json.days).toEqual(['2025-10-26']);
    expect(two.json.rows).toHaveLength(25);
    const { issued_at: _a, ...restTwo } = two.json;
    const { issued_at: _b, ...restOne } = one.json;
    expect(restTwo).toEqual(restOne);
    expect(two.stderr).toContain(`${driversFile}: read as ';'-separated with decimal commas`);
  }, 120_000);

  it('names the delivery day, the time it was issued and the model, and says plainly that the day is past', async () => {
    const { json, stderr } = await forecast(['--input', historyFile, '--drivers', driversFile]);
    expect(json).toMatchObject({ model: 'linear', kind: 'linear', days: ['2025-10-26'], days_begun: ['2025-10-26'] });
    expect(json.issued_at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}[+-]\d{2}:\d{2}$/);
    expect(stderr).toMatch(/forecast: delivery day 2025-10-26 \(25 periods, Europe\/Berlin\), issued \d{4}-\d{2}-\d{2}T[\d:]+[+-]\d{2}:\d{2} by model "linear" \(linear, trained on \d{4}-\d{2}-\d{2} to 2025-10-25\), 90 % bands\./);
    expect(stderr).toMatch(/forecast: note: delivery day 2025-10-26 is already past \(today is \d{4}-\d{2}-\d{2} in Europe\/Berlin\): the day-ahead auction for it is over, so this forecast can no longer be traded on\./);
  });

  it('with the clock on the morning before the delivery day, issues it without a warning; on the day itself, says it is today', async () => {
    const capture = async (now: number) => {
      let stderr = '';
      const err = process.stderr.write, out = process.stdout.write;
      process.stderr.write = ((s: string) => { stderr += s; return true; }) as never;
      process.stdout.write = (() => true) as never;
      try {
        await forecastCommand({ model, input: historyFile, drivers: driversFile, out: join(dir, 'issued.csv') }, () => now);
      } finally {
        process.stderr.write = err;
        process.stdout.write = out;
      }
      return stderr;
    };
    const morning = await capture(Date.parse('2025-10-25T08:30:00+02:00'));
    expect(morning).toContain(`forecast: delivery day 2025-10-26 (25 periods, Europe/Berlin), issued 2025-10-25T08:30:00+02:00 by model "linear"`);
    expect(morning).toContain(`written to ${join(dir, 'issued.csv')}.`);
    expect(morning).not.toMatch(/note:/);
    const sameDay = await capture(Date.parse('2025-10-26T09:00:00+01:00'));
    expect(sameDay).toMatch(/note: delivery day 2025-10-26 is today \(today is 2025-10-26 in Europe\/Berlin\)/);
    expect(readFileSync(join(dir, 'issued.csv'), 'utf8').split('\n')[0]).toBe('timestamp,forecast,lower,upper');
  });

  it.each([
    ['lacks a driver column', 'timestamp,load_forecast\n2025-10-26T00:00:00+02:00,5000\n', /^spotloom: .*drivers-bad\.csv: row 1: lacks the driver column "wind_forecast" that .*history\.csv has/],
    ['has a price', 'timestamp,price,load_forecast,wind_forecast\n2025-10-26T00:00:00+02:00,50,5000,10\n', /drivers-bad\.csv: row 2, column "price": the drivers file gives the forecast day's driver forecasts only/],
    ['starts inside the history', 'timestamp,load_forecast,wind_forecast\n2025-10-25T23:00:00+02:00,5000,10\n', /drivers-bad\.csv: row 2, column "timestamp": "2025-10-25T23:00:00\+02:00" is not after the last price of/],
  ])('refuses a drivers file that %s: exit 2, one line, no stack trace', async (_what, text, message) => {
    const r = await runMain(['forecast', '--model', model, '--input', historyFile, '--drivers', writeFile(dir, 'drivers-bad.csv', text)]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message);
  });
});
