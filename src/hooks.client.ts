import { config } from 'zod/v4/core';

// zod probes for `new Function` (its faster parsers) the first time it parses; the pages' Content-Security-Policy
// forbids evaluating strings, so the browser would report a violation. Parsing works the same without it.
config({ jitless: true });
