// The page's content security policy has no 'unsafe-eval', so zod cannot compile its parsers in the
// browser anyway. Telling it so (jitless) before any schema is parsed stops its probe with
// `new Function`, which the browser reports as a policy violation even though zod catches the throw.
// Set through the global zod reads its configuration from (zod/v4/core's `config` writes the same
// object), so this page-wide setting does not pull zod into every page's first load;
// hooks.client.spec.ts checks zod still reads it from there.
const g = globalThis as { __zod_globalConfig?: { jitless?: boolean } };
// Changed in place: zod keeps a reference to this object once loaded.
(g.__zod_globalConfig ??= {}).jitless = true;

export {};
