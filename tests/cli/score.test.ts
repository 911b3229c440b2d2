import { describe, expect, it } from 'vitest';
import { runMain } from './in-process';
import { scratch, writeFile } from './run-cli';

/** Scoring what was issued: the file `forecast --out` writes, with the actual prices from the auction's file. */
const dir = scratch();
const hours = Array.from({ length: 24 }, (_, h) => `2025-10-27T${String(h).padStart(2, '0')}:00:00+01:00`);
const actual = hours.map((_, h) => 50 + 10 * Math.sin(h / 3));
const forecast = actual.map((a, h) => a + (h % 5) - 2);
const issued = writeFile(dir, 'issued.csv', `timestamp,forecast,lower,upper\n${hours.map((t, h) => `${t},${forecast[h].toFixed(2)},${(forecast[h] - 1.5).toFixed(2)},${(forecast[h] + 1.5).toFixed(2)}`).join('\n')}\n`);
// the auction's prices, from a continental desk: ;, decimal commas, local time
const prices = writeFile(dir, 'prices.csv', `timestamp;price\n${hours.map((t, h) => `${t.slice(0, 16).replace('T', ' ')};${actual[h].toFixed(2).replace('.', ',')}`).join('\n')}\n`);
const joined = writeFile(dir, 'joined.csv', `timestamp,actual,forecast,lower,upper\n${hours.map((t, h) => `${t},${actual[h].toFixed(2)},${forecast[h].toFixed(2)},${(forecast[h] - 1.5).toFixed(2)},${(forecast[h] + 1.5).toFixed(2)}`).join('\n')}\n`);

describe('spotloom score --actuals FILE', () => {
  it('scores the issued file against the prices file exactly as the file with the actual column joined by hand', async () => {
    const a = await runMain(['score', '--input', issued, '--actuals', prices, '--json']);
    const b = await runMain(['score', '--input', joined, '--json']);
    expect(a.status, a.stderr).toBe(0);
    expect(JSON.parse(a.stdout)).toEqual(JSON.parse(b.stdout));
    expect(a.stderr).toContain(`${prices}: read as ';'-separated with decimal commas`);
  });

  it('reports lower and upper as a band: the share of actual prices inside it (counted here by hand)', async () => {
    // forecast error (h % 5) - 2 is inside ±1.5 unless it is ±2: hours with h % 5 of 0 or 4 fall outside
    const inside = hours.filter((_, h) => h % 5 !== 0 && h % 5 !== 4).length;
    const json = JSON.parse((await runMain(['score', '--input', issued, '--actuals', prices, '--json'])).stdout);
    expect(json.band).toEqual({ coverage: inside / 24, periods: 24 });
    expect(Object.keys(json.columns)).toEqual(['forecast', 'lower', 'upper']);
    const text = await runMain(['score', '--input', issued, '--actuals', prices]);
    expect(text.stdout).toContain(`band lower..upper: ${inside} of 24 actual prices inside (${(100 * inside / 24).toFixed(1)} %)`);
    expect(text.stdout.split('\n').filter((l) => /^(lower|upper)\s/.test(l))).toEqual([]);
    expect(text.stdout).toMatch(/^forecast\s+\d/m);
  });

  it('counts the periods whose price has not come in yet, and refuses a file none of whose periods has one', async () => {
    const part = writeFile(dir, 'part.csv', `timestamp,price\n${hours.slice(0, 20).map((t, h) => `${t},${actual[h]}`).join('\n')}\n`);
    const r = await runMain(['score', '--input', issued, '--actuals', part]);
    expect(r.status).toBe(0);
    expect(r.stderr).toContain(`${issued}: 4 periods of 24 have no price in ${part} yet; scores skip them`);
    const other = writeFile(dir, 'other.csv', 'timestamp,price\n2025-01-01T00:00Z,1\n2025-01-01T01:00Z,2\n');
    const none = await runMain(['score', '--input', issued, '--actuals', other]);
    expect(none.status).toBe(2);
    expect(none.stderr.trim().split('\n').pop()).toBe(`spotloom: ${issued}: none of its 24 periods has a price in ${other}; check that the two files cover the same delivery day`);
  });

  it('refuses a file that has an actual column as well', async () => {
    const r = await runMain(['score', '--input', joined, '--actuals', prices]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n').pop()).toBe(`spotloom: ${joined}: row 1, column "actual": has an "actual" column, and the actual prices come from another file too; give them in one place`);
  });
});
