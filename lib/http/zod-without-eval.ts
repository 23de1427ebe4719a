import type { z } from "zod";

// Zod 4 compiles object parsers with `new Function` when it is allowed to, and finds out by trying
// once when the first object schema is built. Under the Content-Security-Policy (no 'unsafe-eval',
// lib/http/security-headers.mjs) that try is a reported violation on every page that builds a
// schema, though Zod catches it and parses without compiling. Jitless is that same parsing, asked
// for up front. Imported first by the root client component (components/providers.tsx), so it runs
// before any page's schemas are built.
//
// Written into the global object that zod's `config()` keeps (zod/v4/core, core.js: it adopts one
// that is already there) rather than by calling `config`: importing even zod/v4/core puts about
// 5 kB gzip of Zod on every page, most of which build no schema. tests/unit/security checks that
// `z.config()` then reports jitless, so a zod upgrade that renames the object fails there.
type ZodGlobal = typeof globalThis & { __zod_globalConfig?: z.core.$ZodConfig };

const global = globalThis as ZodGlobal;
global.__zod_globalConfig ??= {};
global.__zod_globalConfig.jitless = true;
