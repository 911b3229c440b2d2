// npm run bench: the task pane's start-up script, what taskpane.html loads
// before any lazy chunk (office.js aside), in the production build in dist/
// (built first when older than its sources, as the browser tests do), beside
// the budget of issue #13 (≤ 900 KB; tests/build/startup-size.test.ts holds
// the build to it). Also a few lazy chunks, for a look.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import buildOnce, { DIST } from '../tests/e2e/support/build-once';

const BUDGET = 900_000;
buildOnce();
const scripts = [...readFileSync(join(DIST, 'taskpane.html'), 'utf8').matchAll(/<script[^>]*src="?([^"\s>]+)"?/g)].map((m) => m[1]).filter((s) => !s.startsWith('office-js/'));
const total = scripts.reduce((sum, s) => sum + statSync(join(DIST, s)).size, 0);
console.log(`${'task pane start-up script (taskpane.html, office.js aside)'.padEnd(64)}${(total / 1000).toFixed(0).padStart(10)} KB  budget ≤ ${BUDGET / 1000} KB: ${total <= BUDGET ? 'met' : 'MISSED'}`);
const lazy = readdirSync(DIST).filter((f) => f.endsWith('.js') && !scripts.includes(f));
const size = (prefix: string) => (Math.max(0, ...lazy.filter((f) => f.startsWith(prefix)).map((f) => statSync(join(DIST, f)).size)) / 1000).toFixed(0);
console.log(`  lazy chunks: DE's holiday rules ${size('holidays-DE')} KB, charts ${size('charts')} KB, ${lazy.filter((f) => f.startsWith('holidays-')).length} countries in all`);
