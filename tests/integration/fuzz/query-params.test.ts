import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { hostileId, hostileQuery, NAN_LIKE, TRICKY_UNICODE } from "./bad-input";
import { callRoute, expectRefusal, fuzz } from "./call-route";
import { fuzzSession } from "./session";
import { QUERY_TARGETS, type QueryTarget } from "./targets";
import { changedTables, startFuzzWorld, tableDigest, type FuzzWorld } from "./world";

// Property-based fuzzing of the GET routes that read query parameters or a path id: known keys with
// hostile values (NaN-like numbers, NUL and other tricky unicode, 6000-character values), unknown
// and repeated keys. A GET either answers 200 with JSON or refuses with a clear 4xx; the provider's
// cancel link always redirects. Nothing is ever a 500, and nothing is written.

vi.mock("@/lib/auth/config", async () => ({ auth: (await import("@/tests/integration/fuzz/session")).fakeAuth }));
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

const RUNS = 80;
const ID_RUNS = 30;

let world: FuzzWorld;

beforeAll(async () => {
  world = await startFuzzWorld("fuzz_queries");
});

afterAll(async () => {
  await world?.close();
});

async function expectAnswer(target: QueryTarget, response: Response, context: string) {
  if (target.file === "checkout/cancel/route.ts") {
    // The cart was never changed, so whatever the link carries it lands there.
    expect(response.status, context).toBe(303);
    expect(new URL(response.headers.get("location") ?? "").pathname, context).toBe("/cart");
    return;
  }
  if (response.status === 200) {
    expect(response.headers.get("content-type") ?? "", context).toMatch(/application\/json/);
    await response.json();
    return;
  }
  await expectRefusal(response, context);
}

function label(target: QueryTarget): string {
  return `GET app/api/${target.file}${target.as ? ` as ${target.as}` : " as a visitor"}`;
}

describe.each(QUERY_TARGETS.map((t) => [label(t), t] as const))("%s", (_name, target) => {
  it("answers hostile query strings with 200 or a clear 4xx and writes nothing", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const baseline = await tableDigest(world.pool);
    await fuzz(
      hostileQuery(target.keys),
      async (query) => {
        const context = `${label(target)}?${new URLSearchParams(query).toString().slice(0, 300)}`;
        await expectAnswer(target, await callRoute(target.file, "GET", { params, query }), context);
        expect(changedTables(baseline, await tableDigest(world.pool)), `${context} wrote to the database`).toEqual([]);
      },
      RUNS,
    );
  });

  it.skipIf(target.keys.length === 0)("answers every known key with each NaN-like and tricky-unicode value", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const values = [...NAN_LIKE, ...TRICKY_UNICODE.filter((v): v is string => typeof v === "string"), "q".repeat(6000)];
    for (const key of target.keys) {
      for (const value of values) {
        const context = `${label(target)}?${key}=${JSON.stringify(value.slice(0, 60))}`;
        await expectAnswer(target, await callRoute(target.file, "GET", { params, query: [[key, value]] }), context);
      }
    }
  });

  it("answers keys named like Object.prototype's members, given once and twice", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    for (const key of ["constructor", "toString", "__proto__", "hasOwnProperty", "valueOf", "prototype"]) {
      for (const query of [[[key, "1"]], [[key, "1"], [key, "2"]]] as [string, string][][]) {
        const context = `${label(target)}?${new URLSearchParams(query).toString()}`;
        await expectAnswer(target, await callRoute(target.file, "GET", { params, query }), context);
      }
    }
  });

  it.skipIf(!target.fuzzParams?.length)("answers ids of nothing with a 404", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    await fuzz(
      fc.tuple(fc.constantFrom(...(target.fuzzParams ?? ["id"])), hostileId),
      async ([name, id]) => {
        const context = `${label(target)} with ${name}=${JSON.stringify(id.slice(0, 80))}`;
        const refusal = await expectRefusal(await callRoute(target.file, "GET", { params: { ...params, [name]: id } }), context);
        expect(refusal.status, context).toBe(404);
      },
      ID_RUNS,
    );
  });
});
