// The CSP has no 'unsafe-eval' (lib/http/security-headers.mjs), so Zod must never probe `new Function`
// in the browser. lib/http/zod-without-eval.ts asks for jitless parsing without importing Zod (so
// pages without a schema do not ship it); this checks that the setting lands in the configuration
// zod reads, whichever of the two is loaded first, and that no schema then tries to compile a parser.
import { afterEach, describe, expect, it, vi } from "vitest";

type ZodGlobal = typeof globalThis & { __zod_globalConfig?: unknown };

describe("lib/http/zod-without-eval", () => {
  afterEach(() => {
    vi.restoreAllMocks();
    vi.resetModules();
    delete (globalThis as ZodGlobal).__zod_globalConfig;
  });

  it("turns on jitless parsing when zod was loaded first", async () => {
    const { z } = await import("zod");
    expect(z.config().jitless).not.toBe(true);
    await import("@/lib/http/zod-without-eval");
    expect(z.config().jitless).toBe(true);
  });

  it("turns on jitless parsing when it runs before zod is loaded", async () => {
    delete (globalThis as ZodGlobal).__zod_globalConfig;
    await import("@/lib/http/zod-without-eval");
    const { z } = await import("zod");
    expect(z.config().jitless).toBe(true);
  });

  it("builds and parses object schemas without calling Function", async () => {
    await import("@/lib/http/zod-without-eval");
    const { z } = await import("zod");
    const spy = vi.spyOn(globalThis, "Function");
    const schema = z.object({ name: z.string().min(1), count: z.coerce.number().int() });
    expect(schema.parse({ name: "choke", count: "3" })).toEqual({ name: "choke", count: 3 });
    expect(schema.safeParse({ name: "", count: "x" }).success).toBe(false);
    expect(spy).not.toHaveBeenCalled();
  });
});
