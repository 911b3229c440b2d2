// npm run bench: how long `spotloom --help` takes from a cold Node process,
// the floor of every command line call. Five runs of the compiled command
// line (bin/spotloom.mjs with build/cli fresh), median printed beside the
// target of issue #13 (≤ 0.5 s) and beside `node -e 0`, the bare Node start.
// For comparison one run of the tsx fallback (SPOTLOOM_CLI=source).
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { buildCli, cliBuildIsFresh, ROOT } from '../scripts/cli-build.mjs';

const BIN = join(ROOT, 'bin', 'spotloom.mjs');
const TARGET_S = 0.5;

function seconds(args: string[], env: NodeJS.ProcessEnv = {}): number {
  const t = performance.now();
  const r = spawnSync(process.execPath, args, { env: { ...process.env, ...env }, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  return (performance.now() - t) / 1000;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

if (!cliBuildIsFresh()) await buildCli();
const runs = Array.from({ length: 5 }, () => seconds([BIN, '--help']));
const bare = median(Array.from({ length: 5 }, () => seconds(['-e', '0'])));
const source = seconds([BIN, '--help'], { SPOTLOOM_CLI: 'source' });
const m = median(runs);
const line = (what: string, s: number, note = '') => console.log(`${what.padEnd(64)}${s.toFixed(2).padStart(10)} s${note}`);
line('spotloom --help, compiled (median of 5)', m, `  target ≤ ${TARGET_S} s: ${m <= TARGET_S ? 'met' : 'MISSED'}`);
line('node -e 0 (median of 5)', bare);
line('spotloom --help through tsx (SPOTLOOM_CLI=source, 1 run)', source);
