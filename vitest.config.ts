import { defineConfig } from 'vitest/config';

// TZ is pinned so that nothing depends on the machine's zone; the engine itself
// always names its zone explicitly.
process.env.TZ = 'America/Sao_Paulo';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    // the child-process CLI tests run the compiled command line, built fresh
    globalSetup: ['tests/support/build-cli-once.ts'],
    testTimeout: 60_000,
  },
});
