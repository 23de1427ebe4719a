import { z } from "zod";

// Zod 4 compiles object parsers with `new Function` when it is allowed to, and finds out by trying
// once when the first object schema is built. Under the Content-Security-Policy (no 'unsafe-eval',
// lib/http/security-headers.mjs) that try is a reported violation on every page that builds a
// schema, though Zod catches it and parses without compiling. Jitless is that same parsing, asked
// for up front. Imported first by the root client component (components/providers.tsx), so it runs
// before any page's schemas are built.
z.config({ jitless: true });
