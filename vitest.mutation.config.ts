import { defineConfig } from 'vitest/config';
import base from './vitest.config';

// Vitest for `npm run mutation` (stryker.config.mjs): only the engine's tests and the
// reference checks against outside sources, so that each mutant runs in seconds.
// Importing the base config applies its TZ pin (America/Sao_Paulo) here too. The
// include is replaced, not merged (mergeConfig would append it to the base's).
//
// MUTATION_TESTS=fast leaves out the end-to-end model tests that train networks and
// calibrate LEAR many times (seconds per mutant on 2 busy cores): a slice of
// src/engine/models then runs in minutes, and its score is a lower bound.
const SLOW = [
  'tests/engine/models/learner.test.ts',
  'tests/engine/models/fit-learner.test.ts',
  'tests/engine/models/lear.test.ts',
  'tests/engine/model-file/model-file.test.ts',
  'tests/reference/lear-taylor.test.ts',
];

export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: ['tests/engine/**/*.test.ts', 'tests/reference/**/*.test.ts'],
    exclude: process.env.MUTATION_TESTS === 'fast' ? SLOW : [],
  },
});
