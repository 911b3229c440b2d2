import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { dialects, plainFile } from './dialect-files';
import { runMain } from './in-process';
import { scratch, writeFile } from './run-cli';

/**
 * The same numbers whatever the dialect: one file converted into each dialect
 * a desk exports gives a bit-identical backtest (forecast file and summary),
 * over a test span that holds the 25-hour day 2025-10-26 (Directive 2000/84/EC).
 */
const dir = scratch();
const plain = writeFile(dir, 'plain.csv', plainFile());
const files = Object.entries(dialects(readFileSync(plain, 'utf8'))).map(([name, text]) => [name, writeFile(dir, `${name}.csv`, text)] as const);

async function backtest(input: string, model: string, tag: string) {
  const out = join(dir, `${tag}-${model}.out.csv`);
  const r = await runMain(['backtest', '--input', input, '--test-start', '2025-10-20', '--test-end', '2025-10-31', '--model', model, '--out', out, '--json']);
  expect(r.status, r.stderr).toBe(0);
  const { seconds: _seconds, ...summary } = JSON.parse(r.stdout.trim());
  return { summary, out: readFileSync(out, 'utf8'), stderr: r.stderr };
}

describe.each(['naive-week', 'linear'])('spotloom backtest --model %s in every dialect', (model) => {
  let reference: Awaited<ReturnType<typeof backtest>>;

  it('on the plain file forecasts the 25 periods of 2025-10-26', async () => {
    reference = await backtest(plain, model, 'plain');
    expect(reference.out.split('\n').filter((l) => l.startsWith('2025-10-26T'))).toHaveLength(25);
    expect(reference.summary.periods).toBeGreaterThan(250);
  });

  it.each(files)('%s gives the identical output, bit for bit', async (name, file) => {
    const got = await backtest(file, model, name);
    expect(got.out).toBe(reference.out);
    expect(got.summary).toEqual(reference.summary);
    if (name.startsWith('semicolon') || name === 'all-at-once') expect(got.stderr).toContain(`${file}: read as ';'-separated with decimal commas`);
    if (name === 'tab') expect(got.stderr).toContain(`${file}: read as tab-separated`);
    if (name === 'missing-markers' || name === 'all-at-once') expect(got.stderr).toMatch(/\d+ cells held a missing marker such as NA or #N\/A/);
  }, 120_000);
});

describe('spotloom backtest --delimiter and --decimal', () => {
  it('override the detection, and refuse what they cannot read with exit 2 and one line', async () => {
    const text = 'timestamp;price\n2025-01-01 00:00;1.234\n2025-01-01 01:00;1.250\n';
    const file = writeFile(dir, 'ambiguous.csv', text);
    const refused = await runMain(['backtest', '--input', file, '--test-start', '2025-01-01', '--model', 'naive-week']);
    expect(refused.status).toBe(2);
    expect(refused.stderr.trim()).toBe(`spotloom: ${file}: row 2, column "price": "1.234" could be 1.234 with a decimal point or 1234 with "." grouping thousands, and no other number in the file tells which; say which is meant (spotloom: --decimal . or --decimal ,)`);
    // with --decimal the file reads (and is then too short for a backtest: a different, clear refusal)
    const told = await runMain(['backtest', '--input', file, '--test-start', '2025-01-01', '--model', 'naive-week', '--decimal', ',']);
    expect(told.stderr).not.toMatch(/could be/);
    expect(told.stderr).toContain("read as ';'-separated with decimal commas");
    const bad = await runMain(['backtest', '--input', file, '--test-start', '2025-01-01', '--delimiter', '|']);
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim()).toBe('spotloom: --delimiter: "|" is not a separator Spotloom reads; give , or ; or tab');
    const both = await runMain(['backtest', '--input', file, '--test-start', '2025-01-01', '--delimiter', ',', '--decimal', ',']);
    expect(both.stderr.trim()).toBe(`spotloom: ${file}: a decimal comma needs ; or tab as the separator (a comma cannot be both)`);
  });

  it('a skipped spring hour in a wall-clock file exits 2 naming file, row and column', async () => {
    const file = writeFile(dir, 'spring.csv', 'timestamp,price\n2025-03-30 01:00,40\n2025-03-30 02:00,41\n2025-03-30 03:00,42\n');
    const r = await runMain(['backtest', '--input', file, '--test-start', '2025-03-30', '--model', 'naive-week']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim()).toBe(`spotloom: ${file}: row 3, column "timestamp": 2025-03-30 02:00 does not exist in Europe/Berlin (the clocks skip it)`);
  });
});
