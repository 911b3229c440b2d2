import { z } from 'zod';

/**
 * The pane runs under a Content-Security-Policy without 'unsafe-eval'. zod
 * probes once for `new Function` to speed up object parsing; the probe is
 * caught, but the browser still reports it as a policy violation. Parsing
 * without the probe (jitless) gives the same results, a little slower.
 * Imported first by mount.ts, before any schema parses.
 */
z.config({ jitless: true });
