// The access-matrix cells the browser run leaves out because they change the demo data the other
// browser tests rely on (tests/support/access-matrix.ts, `notOverHttp`): here the route handler is
// called directly, as that person, against a database and a payments stand-in of this file's own.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { fillPath, PERSONA_USER_IDS, ROUTES, type Persona } from "../../support/access-matrix";
import { startActionWorld, type ActionWorld } from "./action-world";

const state = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/config", () => ({ auth: async () => (state.userId ? { user: { id: state.userId } } : null) }));
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

let w: ActionWorld;
beforeAll(async () => {
  w = await startActionWorld();
}, 120_000);
afterAll(async () => {
  await w?.close();
});

const cells = ROUTES.flatMap((entry) => (entry.notOverHttp?.personas ?? []).map((persona) => ({ entry, persona })));

describe("route cells tried by calling the handler", () => {
  it("there are some (the browser run skips exactly these)", () => {
    expect(cells.length).toBeGreaterThan(0);
  });

  for (const { entry, persona } of cells) {
    it(`${entry.method} ${entry.path} as ${persona}`, async () => {
      state.userId = persona === "visitor" ? null : PERSONA_USER_IDS[persona as Exclude<Persona, "visitor">];
      const handlers = (await import(/* @vite-ignore */ `@/${entry.file}`)) as Record<string, (r: Request, c: unknown) => Promise<Response>>;
      const url = `http://localhost:3999${fillPath(entry.path, {})}`;
      const res = await handlers[entry.method]!(new Request(url, { method: entry.method }), { params: Promise.resolve({}) });
      const expected = String(entry.expect[persona]);
      expect(res.status).toBeGreaterThanOrEqual(300);
      expect(res.status).toBeLessThan(400);
      const location = new URL(res.headers.get("location") ?? "", url);
      if (expected === "redirect:payments") {
        // The provider's hosted onboarding page for a payout account that now exists.
        expect(location.origin).toBe(new URL(w.fake.url).origin);
      } else {
        expect(`redirect:${location.pathname}${location.search}`.startsWith(expected)).toBe(true);
      }
    });
  }
});
