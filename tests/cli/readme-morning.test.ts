import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { scratch } from './run-cli';

/**
 * The README's "A desk's morning" runs as printed: each command of its code
 * block, in a fresh folder, exits 0. `npx spotloom` is run as
 * `node bin/spotloom.mjs` (what npx finds in a clone after `npm install`),
 * since the temp folder has no node_modules of its own.
 */
const ROOT = join(__dirname, '..', '..');
const BIN = join(ROOT, 'bin', 'spotloom.mjs');

function morningCommands(): string[] {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const section = readme.slice(readme.indexOf("## A desk's morning"));
  const block = /```\n([\s\S]*?)```/.exec(section)?.[1] ?? '';
  return block.split('\n').map((l) => l.replace(/#.*$/, '').trim()).filter((l) => l.length > 0);
}

/** The command of "Why tomorrow moves" and the output printed under it. */
function whyBlocks(): { command: string; printed: string } {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const section = readme.slice(readme.indexOf('## Why tomorrow moves'));
  const [command, printed] = [...section.matchAll(/```\n([\s\S]*?)```/g)].slice(0, 2).map((m) => m[1]);
  return { command: command.trim(), printed };
}

describe("the README's morning", () => {
  const commands = morningCommands();

  it('has the demo, then the three commands of a morning: train once, forecast daily, score what was issued', () => {
    expect(commands.map((c) => c.split(' ').slice(0, 3).join(' '))).toEqual([
      'npx spotloom demo', 'npx spotloom train', 'npx spotloom forecast', 'npx spotloom score',
    ]);
    expect(commands[2]).toMatch(/--drivers \S+/);
    expect(commands[3]).toMatch(/--actuals \S+/);
  });

  it('runs as printed in a fresh folder, each command exiting 0', () => {
    const dir = scratch();
    const outputs: { stdout: string; stderr: string }[] = [];
    for (const command of commands) {
      const args = command.split(/\s+/).slice(2);
      const r = spawnSync(process.execPath, [BIN, ...args], { cwd: dir, encoding: 'utf8', timeout: 600_000 });
      expect(r.status, `${command}\n${r.stderr.slice(-2000)}`).toBe(0);
      outputs.push({ stdout: r.stdout, stderr: r.stderr });
    }
    // the forecast named its delivery day and model and wrote the issued file; the score graded it
    const issued = /--out (\S+)/.exec(commands[2])![1];
    expect(existsSync(join(dir, issued))).toBe(true);
    expect(outputs[2].stderr).toMatch(/forecast: delivery day 2026-11-30 \(24 periods, Europe\/Berlin\), issued .* by model "desk-linear"/);
    expect(outputs[2].stderr).toMatch(/2026-11-30 is already past/);
    expect(outputs[3].stdout).toMatch(/^forecast\s+\d+\.\d{3}/m);
    expect(outputs[3].stdout).toMatch(/band lower\.\.upper: \d+ of 24 actual prices inside/);
    // "Why tomorrow moves": its explain command, on the same files, prints what the README shows
    const why = whyBlocks();
    expect(why.command).toMatch(/^npx spotloom explain /);
    const r = spawnSync(process.execPath, [BIN, ...why.command.split(/\s+/).slice(2)], { cwd: dir, encoding: 'utf8', timeout: 600_000 });
    expect(r.status, r.stderr.slice(-2000)).toBe(0);
    expect(r.stdout).toBe(why.printed);
  }, 900_000);
});
