// Every page and route method of the access matrix (tests/support/access-matrix.ts), requested over
// HTTP from the running production build as each kind of person, compared with what the matrix says
// they get. Sessions are rows in `sessions`, as Auth.js's database strategy keeps them, sent in its
// cookie (lib/auth/config.ts; on http the name has no __Secure- prefix, per Auth.js's defaults).
// Then every state-changing route is sent the same request as another site would make a browser
// send it (RFC 6454 Origin; Fetch Metadata's Sec-Fetch-Site; a CORS simple request's text/plain
// body, Fetch standard §3.2.3) by someone the guard lets through: it must be refused, unread.
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createAccessFixtures, createSessions, removeAccessFixtures, removeSessions, type AccessFixtures } from "../support/access-fixtures";
import { fillPath, PAGES, PERSONAS, ROUTES, type PageOutcome, type Persona, type RouteEntry, type RouteOutcome } from "../support/access-matrix";
import { BASE_URL } from "./support/browser";

const PAYMENTS_URL = process.env.E2E_PAYMENTS_URL ?? "http://127.0.0.1:4120";
const SESSION_COOKIE = "authjs.session-token";
const FOREIGN_ORIGIN = "http://evil.example";

let pool: pg.Pool;
let fixtures: AccessFixtures;
let tokens: Record<Exclude<Persona, "visitor">, string>;

beforeAll(async () => {
  pool = new pg.Pool({ connectionString: process.env.E2E_DATABASE_URL, max: 2 });
  fixtures = await createAccessFixtures(pool);
  tokens = await createSessions(pool);
});

afterAll(async () => {
  if (fixtures) await removeAccessFixtures(pool, fixtures);
  if (tokens) await removeSessions(pool, tokens);
  await pool?.end();
});

function cookieFor(persona: Persona): Record<string, string> {
  return persona === "visitor" ? {} : { cookie: `${SESSION_COOKIE}=${tokens[persona]}` };
}

/** Where a redirect points: "payments" for the payment provider's pages, else the path on this site. */
function redirectTarget(location: string): string {
  const url = new URL(location, BASE_URL);
  if (url.origin === new URL(PAYMENTS_URL).origin) return "payments";
  return `${url.pathname}${url.search}`;
}

function matchesRedirect(expected: string, actual: string): boolean {
  const want = expected.slice("redirect:".length);
  return want === "payments" ? actual === "payments" : actual.startsWith(want);
}

async function pageOutcome(path: string, persona: Persona): Promise<{ outcome: string; html: string }> {
  const res = await fetch(`${BASE_URL}${path}`, { redirect: "manual", headers: cookieFor(persona) });
  const html = await res.text();
  if (res.status >= 300 && res.status < 400) return { outcome: `redirect:${redirectTarget(res.headers.get("location") ?? "")}`, html };
  // Under a loading.tsx the shell is sent (200) before the page calls notFound(); the 404 then travels
  // in the streamed payload and the browser shows the not-found page.
  if (res.status === 404 || html.includes('data-testid="not-found"') || html.includes("NEXT_HTTP_ERROR_FALLBACK;404")) return { outcome: "not-found", html };
  if (res.status !== 200) return { outcome: `status ${res.status}`, html };
  if (html.includes('data-testid="sign-in-prompt"')) return { outcome: "sign-in", html };
  if (html.includes('data-testid="not-allowed"')) return { outcome: "not-allowed", html };
  return { outcome: "ok", html };
}

function pageMatches(expected: PageOutcome, actual: { outcome: string; html: string }): boolean {
  if (expected.startsWith("redirect:")) return actual.outcome.startsWith("redirect:") && matchesRedirect(expected, actual.outcome.slice("redirect:".length));
  if (expected.startsWith("ok:")) return actual.outcome === "ok" && actual.html.includes(expected.slice(3));
  return actual.outcome === expected;
}

async function routeRequest(entry: RouteEntry, persona: Persona, extra: { headers?: Record<string, string>; contentType?: string } = {}): Promise<Response> {
  const headers: Record<string, string> = { ...cookieFor(persona), accept: "application/json" };
  // A browser names the page's origin on every POST; this one is the app's own.
  if (entry.method !== "GET") headers.origin = new URL(BASE_URL).origin;
  if (entry.body !== undefined) headers["content-type"] = extra.contentType ?? "application/json";
  return fetch(`${BASE_URL}${fillPath(entry.path, fixtures)}`, {
    method: entry.method,
    redirect: "manual",
    headers: { ...headers, ...extra.headers },
    body: entry.body === undefined ? undefined : JSON.stringify(entry.body),
  });
}

async function routeOutcome(entry: RouteEntry, persona: Persona): Promise<string> {
  const res = await routeRequest(entry, persona);
  if (res.status >= 300 && res.status < 400) {
    await res.body?.cancel();
    return `redirect:${redirectTarget(res.headers.get("location") ?? "")}`;
  }
  const text = await res.text();
  let code = "";
  try {
    code = String((JSON.parse(text) as { error?: unknown }).error ?? "");
  } catch {
    // not JSON (e.g. the SDK's own answers): the status alone
  }
  return code ? `${res.status}:${code}` : String(res.status);
}

function routeMatches(expected: RouteOutcome, actual: string): boolean {
  if (typeof expected === "number") return actual.split(":")[0] === String(expected);
  if (expected.startsWith("redirect:")) return actual.startsWith("redirect:") && matchesRedirect(expected, actual.slice("redirect:".length));
  return actual === expected;
}

describe("pages, as each kind of person", () => {
  for (const entry of PAGES) {
    it(`${entry.path} (${entry.file})`, async () => {
      const wrong: string[] = [];
      for (const persona of PERSONAS) {
        const actual = await pageOutcome(fillPath(entry.path, fixtures), persona);
        if (!pageMatches(entry.expect[persona], actual)) wrong.push(`${persona}: expected ${entry.expect[persona]}, got ${actual.outcome}`);
      }
      expect(wrong, `${entry.file}\n  ${wrong.join("\n  ")}`).toEqual([]);
    });
  }
});

describe("route handlers, as each kind of person", () => {
  for (const entry of ROUTES) {
    it(`${entry.method} ${entry.path} (${entry.file})`, async () => {
      const wrong: string[] = [];
      for (const persona of PERSONAS) {
        if (entry.notOverHttp?.personas.includes(persona)) continue;
        const actual = await routeOutcome(entry, persona);
        if (!routeMatches(entry.expect[persona], actual)) wrong.push(`${persona}: expected ${entry.expect[persona]}, got ${actual}`);
      }
      expect(wrong, `${entry.file} ${entry.method}\n  ${wrong.join("\n  ")}`).toEqual([]);
    });
  }
});

/** Someone the session guard lets through, so a refusal can only come from the cross-site check. */
function passesTheGuard(entry: RouteEntry): Persona | undefined {
  return PERSONAS.find((p) => {
    const o = entry.expect[p];
    const status = typeof o === "number" ? o : Number(String(o).split(":")[0]);
    return status !== 401 && status !== 403 && !entry.notOverHttp?.personas.includes(p);
  });
}

describe("state-changing routes refuse requests another site makes the browser send", () => {
  const changing = ROUTES.filter((r) => r.method !== "GET" && !r.ownChecks);

  it("covers the state-changing routes (a filter that kept none would pass everything below)", () => {
    const files = changing.map((r) => `${r.file} ${r.method}`);
    for (const known of ["app/api/cart/route.ts DELETE", "app/api/admin/users/[id]/roles/route.ts POST", "app/api/orders/[id]/ship/route.ts POST", "app/api/sell/listings/[id]/stock/route.ts PATCH"]) {
      expect(files).toContain(known);
    }
  });

  for (const entry of changing) {
    it(`${entry.method} ${entry.path}`, async () => {
      const persona = passesTheGuard(entry);
      expect(persona, "someone must pass the guard for this check to mean anything").toBeDefined();
      const who = persona!;
      const foreign = await routeRequest(entry, who, { headers: { origin: FOREIGN_ORIGIN } });
      expect(foreign.status, "a foreign Origin").toBe(403);
      expect(await foreign.json()).toMatchObject({ error: "cross_site" });
      const fetchMetadata = await routeRequest(entry, who, { headers: { "sec-fetch-site": "cross-site" } });
      expect(fetchMetadata.status, "Sec-Fetch-Site: cross-site").toBe(403);
      await fetchMetadata.body?.cancel();
      const sibling = await routeRequest(entry, who, { headers: { "sec-fetch-site": "same-site" } });
      expect(sibling.status, "Sec-Fetch-Site: same-site (a sibling subdomain is another origin)").toBe(403);
      await sibling.body?.cancel();
      if (entry.body !== undefined) {
        // The body a form on another site could send without asking first: JSON text labelled text/plain.
        const simple = await routeRequest(entry, who, { contentType: "text/plain;charset=UTF-8" });
        expect(simple.status, "a text/plain body").toBe(415);
        expect(await simple.json()).toMatchObject({ error: "unsupported_media_type" });
      }
    });
  }
});
