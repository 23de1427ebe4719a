import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { badBodies, hostileId, toJsonText } from "./bad-input";
import { callRoute, expectRefusal, fuzz, namesField } from "./call-route";
import { fuzzSession } from "./session";
import { BODY_TARGETS, type BodyTarget } from "./targets";
import { changedTables, startFuzzWorld, tableDigest, type FuzzWorld } from "./world";

// Property-based fuzzing of every route that takes a JSON body (fast-check; the catalogue of
// hostile input is in bad-input.ts). For each route, as the person whose request reaches its input
// parsing: text that is not JSON, JSON of the wrong shape, and a valid example with one field
// replaced or dropped — only bodies the route's own schema refuses, so no request may act. Then
// path ids of nothing with a valid body, and 2 MB bodies. Every answer must be a 4xx with a JSON
// error and message (field errors on a 422, naming the replaced field), no handler may throw, and
// a digest of every table must not move.

vi.mock("@/lib/auth/config", async () => ({ auth: (await import("@/tests/integration/fuzz/session")).fakeAuth }));
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

const RUNS = 60;
const ID_RUNS = 20;
const MB = 1024 * 1024;

let world: FuzzWorld;

beforeAll(async () => {
  world = await startFuzzWorld("fuzz_bodies");
});

afterAll(async () => {
  await world?.close();
});

function accepts(target: BodyTarget) {
  // Several routes read a missing body as `{}`; refusing what they would read that way too.
  return target.schema ? (body: unknown) => target.schema!.safeParse(body ?? {}).success : undefined;
}

async function expectNothingWritten(before: Record<string, string>, context: string) {
  const changed = changedTables(before, await tableDigest(world.pool));
  expect(changed, `${context} wrote to the database`).toEqual([]);
}

type Path = (string | number)[];

/** Where the strings are in a body: ["reasons", 0, "text"]. */
function stringPaths(value: unknown, at: Path = []): Path[] {
  if (typeof value === "string") return [at];
  if (Array.isArray(value)) return value.flatMap((v, i) => stringPaths(v, [...at, i]));
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => stringPaths(v, [...at, k]));
  return [];
}

function getPath(value: unknown, path: Path): unknown {
  return path.reduce<unknown>((v, key) => (v as Record<string | number, unknown>)[key], value);
}

function setPath(value: unknown, path: Path, to: unknown): void {
  const parent = getPath(value, path.slice(0, -1)) as Record<string | number, unknown>;
  parent[path[path.length - 1]!] = to;
}

function label(target: BodyTarget): string {
  return `${target.method} app/api/${target.file}${target.as ? ` as ${target.as}` : " as a visitor"}`;
}

describe.each(BODY_TARGETS.map((t) => [label(t), t] as const))("%s", (_name, target) => {
  it("refuses malformed, wrong-shaped and wrong-typed bodies with a clear 4xx and writes nothing", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const example = target.example?.(world.ids);
    const baseline = await tableDigest(world.pool);
    await fuzz(
      badBodies(example, accepts(target)),
      async (bad) => {
        const context = `${label(target)} with a ${bad.label} body${bad.field ? ` (field ${bad.field})` : ""}: ${bad.text.slice(0, 200)}`;
        const refusal = await expectRefusal(await callRoute(target.file, target.method, { params, body: bad.text }), context);
        expect([413, 422], context).toContain(refusal.status);
        if (bad.label === "malformed") expect(refusal.status, context).toBe(422);
        if (bad.field && refusal.status === 422) expect(namesField(refusal.fieldErrors, bad.field), `${context}: no field error names ${bad.field}`).toBe(true);
        await expectNothingWritten(baseline, context);
      },
      RUNS,
    );
  });

  it.skipIf(!target.example)("refuses a NUL inside each text field of an otherwise valid body (PostgreSQL cannot store one)", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const example = target.example?.(world.ids) ?? {};
    const baseline = await tableDigest(world.pool);
    for (const path of stringPaths(example)) {
      const body = structuredClone(example);
      const text = String(getPath(body, path));
      setPath(body, path, `${text.slice(0, 2)}\u0000${text.slice(2)}`);
      const context = `${label(target)} with a NUL in ${path.join(".")}`;
      const refusal = await expectRefusal(await callRoute(target.file, target.method, { params, body: JSON.stringify(body) }), context);
      expect(refusal.status, context).toBe(422);
      expect(namesField(refusal.fieldErrors, path.join(".")), `${context}: ${JSON.stringify(refusal.fieldErrors)}`).toBe(true);
    }
    await expectNothingWritten(baseline, `${label(target)} with NUL characters`);
  });

  it.skipIf(!target.example)("refuses prototype keys alongside a wrong-typed field, and acts on none of them", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const example = target.example?.(world.ids) ?? {};
    const field = Object.keys(example)[0];
    const baseline = await tableDigest(world.pool);
    const junk = '"__proto__": {"roles": ["admin"], "isAdmin": true}, "constructor": {"prototype": {"x": 1}}, "toString": 1, "hasOwnProperty": "x"';
    for (const text of [`{${junk}}`, `{${junk}, ${JSON.stringify(field ?? "x")}: {"__proto__": null}}`]) {
      // A body the schema would take (approve's optional note) would act: not sent.
      if (accepts(target)?.(JSON.parse(text))) continue;
      const context = `${label(target)} with ${text}`;
      const refusal = await expectRefusal(await callRoute(target.file, target.method, { params, body: text }), context);
      expect(refusal.status, context).toBe(422);
    }
    await expectNothingWritten(baseline, `${label(target)} with prototype keys`);
  });

  it("refuses 2 MB bodies", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const example = target.example?.(world.ids) ?? {};
    const firstKey = Object.keys(example)[0] ?? "padding";
    const baseline = await tableDigest(world.pool);
    const bodies = {
      "a 2 MB string field": toJsonText({ ...example, [firstKey]: "ж".repeat(MB) }),
      "a 2 MB array": `[${"1,".repeat(MB)}1]`,
      "2 MB of nesting": "[".repeat(MB) + "]".repeat(MB),
      "2 MB of junk": "\u0001\u00ff".repeat(MB / 2).repeat(2),
    };
    for (const [what, body] of Object.entries(bodies)) {
      const context = `${label(target)} with ${what}`;
      const refusal = await expectRefusal(await callRoute(target.file, target.method, { params, body }), context);
      expect(refusal.status, context).toBe(413);
    }
    await expectNothingWritten(baseline, `${label(target)} with 2 MB bodies`);
  });

  it.skipIf(!target.fuzzParams?.length)("answers ids of nothing with a 4xx, even with a valid body", async () => {
    fuzzSession.userId = target.as;
    const params = target.params?.(world.ids) ?? {};
    const body = target.example ? toJsonText(target.example(world.ids)) : "";
    const baseline = await tableDigest(world.pool);
    await fuzz(
      fc.tuple(fc.constantFrom(...(target.fuzzParams ?? ["id"])), hostileId),
      async ([name, id]) => {
        const context = `${label(target)} with ${name}=${JSON.stringify(id.slice(0, 80))}`;
        await expectRefusal(await callRoute(target.file, target.method, { params: { ...params, [name]: id }, body }), context);
        await expectNothingWritten(baseline, context);
      },
      ID_RUNS,
    );
  });
});
