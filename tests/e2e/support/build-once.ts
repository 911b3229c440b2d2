import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * vitest globalSetup of the end-to-end run: one production build into
 * dist/ (`webpack --mode production`, 1–2 minutes), unless dist/ is already
 * newer than everything it is built from (src/, webpack.config.js,
 * manifest.xml, package.json, package-lock.json, tsconfig.json), so that
 * running the tests again right after a build does not build again.
 * SPOTLOOM_E2E_BUILD=always builds in any case, =never never does.
 */
export const ROOT = fileURLToPath(new URL('../../..', import.meta.url));
export const DIST = join(ROOT, 'dist');
const INPUTS = ['src', 'scripts', 'webpack.config.js', 'manifest.xml', 'package.json', 'package-lock.json', 'tsconfig.json'];
const OUTPUTS = ['preview.html', 'preview.js', 'taskpane.html', 'runtime.js', 'office-js/office.js'];

function newest(path: string): number {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  return readdirSync(path).reduce((m, name) => Math.max(m, newest(join(path, name))), st.mtimeMs);
}

export function distIsFresh(): boolean {
  const built = OUTPUTS.map((f) => join(DIST, f));
  if (!built.every(existsSync)) return false;
  const oldestOutput = Math.min(...built.map((f) => statSync(f).mtimeMs));
  return INPUTS.every((i) => newest(join(ROOT, i)) <= oldestOutput);
}

export default function setup(): void {
  const mode = process.env.SPOTLOOM_E2E_BUILD ?? 'auto';
  if (mode === 'never' || (mode !== 'always' && distIsFresh())) {
    process.stderr.write('e2e: using the build in dist/ (newer than its sources)\n');
    return;
  }
  process.stderr.write('e2e: building dist/ (webpack --mode production)…\n');
  const started = Date.now();
  const cli = join(ROOT, 'node_modules', 'webpack-cli', 'bin', 'cli.js');
  const run = spawnSync(process.execPath, [cli, '--mode', 'production'], { cwd: ROOT, stdio: ['ignore', 'ignore', 'inherit'] });
  if (run.status !== 0) throw new Error(`the production build failed (exit ${run.status}); run \`npm run build\` to see why`);
  process.stderr.write(`e2e: built in ${((Date.now() - started) / 1000).toFixed(0)} s\n`);
}
