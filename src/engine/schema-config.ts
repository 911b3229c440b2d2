import { z } from 'zod';

// zod can compile fast parsers with `new Function`; Spotloom runs under a
// Content-Security-Policy without 'unsafe-eval' and under Node's
// --disallow-code-generation-from-strings, so it parses without that.
z.config({ jitless: true });

export { z };
