import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CLI_BUILD, cliBuildIsFresh } from '../../scripts/cli-build.mjs';
import { runCli } from './run-cli';

/**
 * bin/spotloom.mjs runs the compiled build (build/cli/main.mjs, written by
 * `prepare` on npm install and by the tests' globalSetup), and the TypeScript
 * source through tsx only as a fallback. The compiled command line must
 * behave exactly as the source does (the source run through tsx is the
 * reference here).
 */
describe('bin/spotloom.mjs', () => {
  it('runs the compiled build, fresh after the tests\' globalSetup', () => {
    expect(existsSync(CLI_BUILD)).toBe(true);
    expect(cliBuildIsFresh()).toBe(true);
    const r = runCli(['--help']);
    expect(r.status).toBe(0);
    expect(r.stderr).not.toMatch(/through tsx/);
  });

  it('prints the same help and the same user error as the source run through tsx', () => {
    for (const args of [['--help'], ['backtest', '--help'], ['forecast', '--model', 'no-such-model.json', '--input', 'no-such.csv']]) {
      const built = runCli(args);
      const source = runCli(args, { SPOTLOOM_CLI: 'source' });
      expect(built).toEqual(source);
    }
  });
});
