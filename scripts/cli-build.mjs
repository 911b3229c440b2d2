// The compiled command line: src/cli/main.ts bundled by esbuild (MIT) into
// build/cli/main.mjs, so that `npx spotloom` starts without compiling
// TypeScript at run time. Run by `npm run build:cli`, which `prepare` calls
// on every `npm install` / `npm ci`; bin/spotloom.mjs runs the source through
// tsx instead when this build is missing or older than src/.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
export const CLI_BUILD = join(ROOT, 'build', 'cli', 'main.mjs');
const SOURCES = join(ROOT, 'src');

function newest(path) {
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  return readdirSync(path).reduce((m, name) => Math.max(m, newest(join(path, name))), st.mtimeMs);
}

/** True when build/cli/main.mjs exists and is newer than every file under src/. */
export function cliBuildIsFresh() {
  if (!existsSync(CLI_BUILD)) return false;
  return !existsSync(SOURCES) || newest(SOURCES) <= statSync(CLI_BUILD).mtimeMs;
}

/**
 * Bundles the command line with the packages it uses into one file: loading
 * one file is about twice as fast as resolving and reading each package's
 * modules from node_modules (measured with bench/cli-startup.ts, 0.36 s
 * against 0.84 s for `--help` on a busy 2-core machine). A CommonJS package's
 * `require` of a Node built-in (or of gpu.js's optional `gl`, absent here and
 * guarded by the package) goes through createRequire.
 */
export async function buildCli() {
  const { build } = await import('esbuild');
  await build({
    entryPoints: [join(ROOT, 'src', 'cli', 'main.ts')],
    outfile: CLI_BUILD,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'warning',
    banner: { js: "import { createRequire as spotloomRequire } from 'node:module'; const require = spotloomRequire(import.meta.url);" },
  });
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) await buildCli();
