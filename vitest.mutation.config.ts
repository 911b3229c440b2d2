import { defineConfig } from 'vitest/config';
import base from './vitest.config';

// Vitest for `npm run mutation` (stryker.config.mjs): only the engine's tests and the
// reference checks against outside sources, so that each mutant runs in seconds.
// Importing the base config applies its TZ pin (America/Sao_Paulo) here too. The
// include is replaced, not merged (mergeConfig would append it to the base's).
export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: ['tests/engine/**/*.test.ts', 'tests/reference/**/*.test.ts'],
  },
});
