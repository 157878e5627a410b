// zod probes for `new Function` (its faster parsers) the first time it parses; the pages' Content-Security-Policy
// forbids evaluating strings, so the browser would report a violation. Parsing works the same without it.
// zod keeps its settings on `globalThis.__zod_globalConfig` and adopts the object already there, so this is set
// without importing zod: this module runs in every page's entry script before any page's code, and pages that
// never validate in the browser should not download zod for it.
const zodGlobal = globalThis as typeof globalThis & { __zod_globalConfig?: { jitless?: boolean } };
(zodGlobal.__zod_globalConfig ??= {}).jitless = true;
