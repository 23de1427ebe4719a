import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { BODY_TARGETS, OTHER_ROUTES, QUERY_TARGETS, type Method } from "./targets";

// The fuzz covers what targets.ts lists; this keeps the list honest. Every route file under app/api
// and every HTTP method it exports must be there (fuzzed, or skipped with a reason), and nothing
// listed may be stale. A new JSON API therefore fails here until it is given a place in the fuzz.

const API = path.resolve(import.meta.dirname, "../../../app/api");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return entry.name === "route.ts" ? [path.relative(API, full).split(path.sep).join("/")] : [];
  });
}

/** The HTTP methods a route module exports: `export const POST =`, `export async function GET(`, `export const { GET, POST } =`. */
export function exportedMethods(source: string): Method[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:async\s+)?(?:function|const|let)\s+([A-Z]+)\b/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s+const\s+\{([^}]*)\}/g)) for (const name of m[1]!.split(",")) found.add(name.trim().split(/\s*:\s*/).pop()!);
  return METHODS.filter((method): method is Method => found.has(method));
}

function listed(): Set<string> {
  return new Set([
    ...BODY_TARGETS.map((t) => `${t.method} ${t.file}`),
    ...QUERY_TARGETS.map((t) => `GET ${t.file}`),
    ...OTHER_ROUTES.flatMap((r) => r.methods.map((m) => `${m} ${r.file}`)),
  ]);
}

describe("the fuzz's route list", () => {
  const onDisk = routeFiles(API).flatMap((file) => exportedMethods(readFileSync(path.join(API, file), "utf8")).map((m) => `${m} ${file}`));

  it("reads the methods a route module exports", () => {
    expect(exportedMethods("export const POST = guardRoute(...);\nexport async function GET(request) {}")).toEqual(["GET", "POST"]);
    expect(exportedMethods("export const { GET, POST } = handlers;")).toEqual(["GET", "POST"]);
    expect(exportedMethods('export const dynamic = "force-dynamic";\nexport function PATCH() {}')).toEqual(["PATCH"]);
  });

  it("names every route handler under app/api", () => {
    expect(onDisk.length).toBeGreaterThan(40);
    const missing = onDisk.filter((entry) => !listed().has(entry));
    expect(missing, "add these to tests/integration/fuzz/targets.ts (BODY_TARGETS, QUERY_TARGETS or OTHER_ROUTES with a reason)").toEqual([]);
  });

  it("lists nothing that is not there", () => {
    const present = new Set(onDisk);
    expect([...listed()].filter((entry) => !present.has(entry))).toEqual([]);
  });
});
