// Mutation testing of the engine (StrykerJS with its vitest runner): `npm run mutation`.
// One folder or a few files: `npm run mutation -- --mutate 'src/engine/metrics/**/*.ts'`.
// Not in CI because of its time; scores per folder are in DEVELOPERS.md (Mutation testing).
/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: 'vitest',
  // Only tests/engine and tests/reference; the TZ pin of vitest.config.ts applies.
  vitest: { configFile: 'vitest.mutation.config.ts' },
  coverageAnalysis: 'perTest',
  mutate: [
    'src/engine/metrics/**/*.ts',
    'src/engine/compare/**/*.ts',
    'src/engine/backtest/**/*.ts',
    'src/engine/models/**/*.ts',
  ],
  // The machine has 2 shared cores; one test process keeps the rest usable.
  concurrency: 1,
  // A mutant in a module-level constant runs every test (no per-test coverage): in
  // src/engine/models those were a third of the mutants and three quarters of the time.
  // They are reported as Ignored, not counted in the score.
  ignoreStatic: true,
  // Added to each test's own time; an endless loop then costs seconds, not a minute.
  timeoutMS: 10_000,
  reporters: ['clear-text', 'progress', 'html', 'json'],
  htmlReporter: { fileName: 'reports/mutation/mutation.html' },
  jsonReporter: { fileName: 'reports/mutation/mutation.json' },
  ignorePatterns: ['dist', 'test-output', 'reports', 'spotloom-demo'],
  tempDirName: '.stryker-tmp',
  cleanTempDir: 'always',
};
