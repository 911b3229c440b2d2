import { buildCli, cliBuildIsFresh } from '../../scripts/cli-build.mjs';

/**
 * vitest globalSetup: the tests that run `spotloom` in a child process
 * (tests/cli/run-cli.ts, no-eval.test.ts, the fuzzed arguments) go through
 * bin/spotloom.mjs, which runs the compiled build/cli/main.mjs. After an edit
 * under src/ that build is stale, so it is rebuilt here first (esbuild, well
 * under a second): the tests then always exercise the compiled command line
 * of the code as it is now, never the tsx fallback.
 */
export default async function setup(): Promise<void> {
  if (!cliBuildIsFresh()) await buildCli();
}
