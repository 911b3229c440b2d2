/**
 * `npm run fuzz`: the fuzz suite (tests/fuzz/*.test.ts) with many more cases
 * than CI runs, from a fresh seed that is printed first so that a failure
 * can be replayed exactly.
 *
 *   npm run fuzz                      # 20x the CI case counts, new seed, 60 spawned CLI runs
 *   npm run fuzz -- --scale 50        # more
 *   npm run fuzz -- --seed 123456     # replay a run
 *   npm run fuzz -- --spawns 200      # more spawned `node bin/spotloom.mjs` runs
 *   npm run fuzz -- metrics           # only files whose name holds "metrics"
 */
import { spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

const argv = process.argv.slice(2);
const option = (name: string): string | undefined => {
  const i = argv.indexOf(`--${name}`);
  if (i < 0) return undefined;
  const [value] = argv.splice(i, 2).slice(1);
  return value;
};
const seed = option('seed') ?? process.env.SPOTLOOM_FUZZ_SEED ?? String(Math.floor(Math.random() * 2 ** 31));
const scale = option('scale') ?? process.env.SPOTLOOM_FUZZ_SCALE ?? '20';
const spawns = option('spawns') ?? process.env.SPOTLOOM_FUZZ_SPAWNS ?? '60';
for (const [name, v] of [['seed', seed], ['scale', scale], ['spawns', spawns]]) {
  if (!/^\d+(\.\d+)?$/.test(v)) {
    process.stderr.write(`fuzz: --${name} must be a number, got "${v}"\n`);
    process.exit(2);
  }
}

process.stdout.write(`fuzz: seed ${seed}, ${scale}x the CI case counts, ${spawns} spawned CLI runs\n`);
process.stdout.write(`fuzz: replay with  npm run fuzz -- --seed ${seed} --scale ${scale} --spawns ${spawns}\n`);

const vitest = join(dirname(createRequire(import.meta.url).resolve('vitest/package.json')), 'vitest.mjs');
const filters = argv.length ? argv.map((f) => `tests/fuzz/${f}`) : ['tests/fuzz'];
const r = spawnSync(process.execPath, [vitest, 'run', ...filters, '--testTimeout', '0', '--hookTimeout', '600000'], {
  stdio: 'inherit',
  env: { ...process.env, SPOTLOOM_FUZZ_SEED: seed, SPOTLOOM_FUZZ_SCALE: scale, SPOTLOOM_FUZZ_SPAWNS: spawns },
});
process.exit(r.status ?? 1);
