import { defineConfig } from 'vitest/config';

// End-to-end tests in a real browser (Debian's chromium through
// playwright-core) against the production build in dist/: `npm run test:e2e`.
// The build runs once per run, in tests/e2e/support/build-once.ts.
// TZ is pinned as in vitest.config.ts; the browser gets the same zone.
process.env.TZ = 'America/Sao_Paulo';

export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    environment: 'node',
    globalSetup: ['tests/e2e/support/build-once.ts'],
    fileParallelism: false,
    testTimeout: 240_000,
    hookTimeout: 240_000,
  },
});
