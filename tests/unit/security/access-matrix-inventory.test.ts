import { describe, expect, it } from "vitest";
import { ACTIONS, entryKey, MATRIX, PAGES, PERSONAS, ROUTES } from "../../support/access-matrix";
import { appInventory, exportedActions, exportedMethods, isServerActionModule } from "./app-inventory";

// The access matrix must name everything the App Router would serve, so a new page, route method
// or server action cannot ship without someone writing down who may use it (and the e2e and
// integration tests then trying it). The file conventions are Next.js's own (App Router docs:
// "page.js", "route.js" with one export per HTTP method, and the "use server" directive).

describe("the access matrix against the app's files", () => {
  const onDisk = appInventory();
  const listed = MATRIX.map(entryKey);

  it("lists every page, route method and server action on disk", () => {
    const missing = onDisk.filter((k) => !listed.includes(k));
    expect(missing, `missing from tests/support/access-matrix.ts:\n  ${missing.join("\n  ")}`).toEqual([]);
  });

  it("lists nothing that is no longer on disk", () => {
    const gone = listed.filter((k) => !onDisk.includes(k));
    expect(gone, `listed in tests/support/access-matrix.ts but gone from app/:\n  ${gone.join("\n  ")}`).toEqual([]);
  });

  it("names each entry once, with an outcome for every kind of person", () => {
    const duplicates = listed.filter((k, i) => listed.indexOf(k) !== i);
    expect(duplicates).toEqual([]);
    for (const entry of MATRIX) expect(Object.keys(entry.expect).sort(), entryKey(entry)).toEqual([...PERSONAS].sort());
  });

  it("finds what the app has today (a scanner that finds nothing would pass the checks above)", () => {
    expect(onDisk.filter((k) => k.startsWith("page ")).length).toBeGreaterThanOrEqual(40);
    expect(onDisk).toContain("route app/api/cart/route.ts PATCH");
    expect(onDisk).toContain("route app/api/auth/[...nextauth]/route.ts POST");
    expect(onDisk).toContain("action app/(sell)/sell/orders/actions.ts shipOrderAction");
    expect(PAGES.length + ROUTES.length + ACTIONS.length).toBe(MATRIX.length);
  });
});

describe("the scanner", () => {
  it("reads the export forms route modules use", () => {
    expect(exportedMethods("export async function GET() {}\nexport const POST = guardRoute();")).toEqual(["GET", "POST"]);
    expect(exportedMethods("export const { GET, POST } = handlers;")).toEqual(["GET", "POST"]);
    expect(exportedMethods('export { GET, handler as PATCH } from "./x";')).toEqual(["GET", "PATCH"]);
    expect(exportedMethods("export const dynamic = 'force-dynamic';\nexport function helper() {}")).toEqual([]);
  });

  it("takes only modules whose first statement is the directive, and only their async exports", () => {
    expect(isServerActionModule('"use server";\nexport async function a() {}')).toBe(true);
    expect(isServerActionModule("'use server'\n")).toBe(true);
    expect(isServerActionModule('import x from "y";\n"use server";')).toBe(false);
    expect(exportedActions('"use server";\nexport type R = {};\nexport async function save() {}\nexport const drop = async () => {};')).toEqual(["drop", "save"]);
  });
});
