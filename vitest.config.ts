import { defineConfig } from 'vitest/config';

// TZ is pinned so that nothing depends on the machine's zone; the engine itself
// always names its zone explicitly.
process.env.TZ = 'America/Sao_Paulo';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
  },
});
