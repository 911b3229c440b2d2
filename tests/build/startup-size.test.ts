import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import buildOnce, { DIST } from '../e2e/support/build-once';

/**
 * The size of what the task pane page loads before anything else can run:
 * the scripts taskpane.html names (the pane and the cell functions, which the
 * shared runtime must register fast), without the host's own office.js and
 * without the lazy chunks (charts, the training worker, holiday rules). Read
 * from the production build in dist/ (minified, as served), which this test
 * shares with the browser tests (tests/e2e/support/build-once.ts builds it
 * once, or not at all when it is newer than its sources).
 * Budget from issue #13: 900 KB (900 000 bytes).
 */
const BUDGET = 900_000;

const scripts = () => [...readFileSync(join(DIST, 'taskpane.html'), 'utf8').matchAll(/<script[^>]*src="?([^"\s>]+)"?/g)].map((m) => m[1]);

beforeAll(() => buildOnce(), 300_000);

describe('the task pane\'s start-up script (production build)', () => {
  it(`stays within ${BUDGET / 1000} KB, office.js aside`, () => {
    const own = scripts().filter((s) => !s.startsWith('office-js/'));
    const sizes = own.map((s) => [s, statSync(join(DIST, s)).size] as const);
    const total = sizes.reduce((sum, [, n]) => sum + n, 0);
    expect(total, sizes.map(([s, n]) => `${s} ${n}`).join(', ')).toBeLessThanOrEqual(BUDGET);
  });

  it('names none of the lazy chunks: holiday rules and their reader, charts, moment', () => {
    const own = scripts().map((s) => readFileSync(join(DIST, s), 'utf8'));
    for (const code of own) {
      expect(code.includes('Tag der Deutschen Einheit')).toBe(false); // DE's rules
      expect(code.includes('vsop87')).toBe(false); // the equinox rules' Earth tables
      expect(code.includes('uPlot')).toBe(false);
      expect(/moment\.tz|momentProperties/.test(code)).toBe(false);
    }
    expect(scripts().some((s) => /holidays-|holiday-parser|charts/.test(s))).toBe(false);
  });
});
