// Zod (shared/api schemas) probes for eval with `new Function` when its schemas are first built;
// under the content security policy (script-src 'self') the browser reports that probe as a
// violation. jitless skips the probe and the compiled fast path; parsing gives the same results.
// A file, not inline, so the policy allows it; loaded before the app's module scripts.
globalThis.__zod_globalConfig = { ...(globalThis.__zod_globalConfig ?? {}), jitless: true };
