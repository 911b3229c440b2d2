#!/usr/bin/env node
// Runs the compiled command line (build/cli/main.mjs, written by `npm install`
// through the `prepare` script). When that build is missing or older than
// src/ (an edit since the last install), or SPOTLOOM_CLI=source is set, it
// runs the TypeScript source through tsx (a development dependency) instead,
// about a second slower per call, and says so on stderr.
import { pathToFileURL } from 'node:url';
import { CLI_BUILD, cliBuildIsFresh } from '../scripts/cli-build.mjs';

let main;
if (process.env.SPOTLOOM_CLI !== 'source' && cliBuildIsFresh()) {
  ({ main } = await import(pathToFileURL(CLI_BUILD).href));
} else {
  if (process.env.SPOTLOOM_CLI !== 'source') {
    process.stderr.write('spotloom: running the TypeScript source through tsx (build/cli is missing or older than src/; `npm run build:cli` compiles it)\n');
  }
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import('../src/cli/main.ts'));
}
process.exitCode = await main(process.argv.slice(2));
