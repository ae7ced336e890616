import { config } from "zod/v4/core";

// Runs in the browser before any page module (Next's instrumentation-client convention), so it precedes every
// schema that lib/validations/* builds at import. zod 4 compiles object parsers with `new Function` when eval is
// allowed and probes for that by trying it; our Content-Security-Policy (lib/security/csp.ts) has no 'unsafe-eval',
// so the probe shows up as a securitypolicyviolation on every page with a form. jitless skips the probe and the
// compiled parsers; the interpreted ones are what the browser would have fallen back to anyway. The server is not
// under a CSP and keeps the compiled parsers.
// config comes from zod's core, which holds the one global config: `import { z } from "zod"` here would put all of
// zod (about 31 KB gzipped) into every page's first load, forms or not.
config({ jitless: true });
