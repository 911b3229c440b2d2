#!/usr/bin/env node
// Runs the TypeScript command line through tsx, so no build step stands
// between `npm install` and `npx spotloom`.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
