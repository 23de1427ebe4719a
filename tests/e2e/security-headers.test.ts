// Sessions and forms against the running production build: the security headers every response
// carries (Content-Security-Policy Level 3, Referrer Policy, X-Content-Type-Options from the Fetch
// standard, Permissions Policy), what they do in Chromium (a frame from another site is refused; an
// image from a host the policy does not name is blocked; the app's own pages cause no violation),
// the session cookie's attributes (RFC 6265bis: HttpOnly, SameSite=Lax; Secure is for https
// addresses and is tested in tests/integration/security/session-cookies.test.ts), and a server
// action posted from another site (Next.js compares Origin with Host and refuses).
import { randomBytes } from "node:crypto";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createAccessFixtures, createSessions, removeAccessFixtures, removeSessions, type AccessFixtures } from "../support/access-fixtures";
import { fillPath, PAGES, type Persona } from "../support/access-matrix";
import { BASE_URL, openBrowser, type Session } from "./support/browser";
import { messagesTo, waitForMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";

const UPLOADS_URL = process.env.E2E_UPLOADS_URL ?? "http://127.0.0.1:4130";

/** Another site: a blank page of its own, with no policy of its own, on 127.0.0.1 (a different site from localhost). */
async function otherSite(): Promise<{ url: string; close(): Promise<void> }> {
  const server = createServer((_req, res) => {
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" });
    res.end("<!doctype html><title>Another site</title><body><p>Another site</p></body>");
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise((resolve) => {
        // Chromium keeps its connections open; close() alone would wait for them.
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
const PAYMENTS_URL = process.env.E2E_PAYMENTS_URL ?? "http://127.0.0.1:4120";
const SESSION_COOKIE = "authjs.session-token";

/** "default-src 'self'; img-src 'self' x" → { "default-src": ["'self'"], "img-src": ["'self'", "x"] } (CSP3 §2.2 parsing, simplified). */
function parseCsp(header: string): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const part of header.split(";")) {
    const [name, ...values] = part.trim().split(/\s+/);
    if (name) out[name.toLowerCase()] = values;
  }
  return out;
}

/** Whether a CSP source list allows an origin: exact, or a host-source with a wildcard port (CSP3 §6.7.2.8). */
function allows(sources: string[] | undefined, origin: string): boolean {
  const { protocol, hostname } = new URL(origin);
  return (sources ?? []).some((s) => s === origin || s === `${protocol}//${hostname}:*`);
}

describe("security headers on every kind of response", () => {
  const samples = ["/", "/catalog", "/sign-in", "/api/health", "/api/listings", "/no-such-page"];

  for (const path of samples) {
    it(path, async () => {
      const res = await fetch(`${BASE_URL}${path}`, { redirect: "manual" });
      await res.body?.cancel();
      const csp = res.headers.get("content-security-policy");
      expect(csp, "Content-Security-Policy").toBeTruthy();
      const d = parseCsp(csp!);
      // CSP3: a production policy without eval, without plugins, without <base> rewriting, never framed.
      expect(d["default-src"]).toEqual(["'self'"]);
      expect(d["script-src"]).toContain("'self'");
      expect(d["script-src"]).not.toContain("'unsafe-eval'");
      expect(d["script-src"]).not.toContain("*");
      expect(d["object-src"]).toEqual(["'none'"]);
      expect(d["base-uri"]).toEqual(["'self'"]);
      expect(d["frame-ancestors"]).toEqual(["'none'"]);
      expect(d["form-action"]).toContain("'self'");
      // The stand-ins' origins: uploaded photos (img-src), the browser's uploads (connect-src), and
      // the hosted checkout a form's redirect may lead to (form-action).
      expect(allows(d["img-src"], UPLOADS_URL), `img-src ${d["img-src"]?.join(" ")}`).toBe(true);
      expect(allows(d["connect-src"], UPLOADS_URL), `connect-src ${d["connect-src"]?.join(" ")}`).toBe(true);
      expect(allows(d["form-action"], PAYMENTS_URL), `form-action ${d["form-action"]?.join(" ")}`).toBe(true);
      expect(allows(d["img-src"], "http://evil.example")).toBe(false);
      // Referrer Policy (W3C): full URLs stay on this site.
      expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
      // Fetch standard: no content sniffing.
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("x-frame-options")).toBe("DENY");
      const permissions = res.headers.get("permissions-policy") ?? "";
      for (const feature of ["camera", "microphone", "geolocation"]) expect(permissions).toContain(`${feature}=()`);
      // A local http address: no HSTS (it would pin localhost to https in the developer's browser).
      expect(res.headers.get("strict-transport-security")).toBeNull();
    });
  }
});

describe("the policy in Chromium", () => {
  let s: Session;
  let pool: pg.Pool;
  let fixtures: AccessFixtures;
  let tokens: Record<Exclude<Persona, "visitor">, string>;

  beforeAll(async () => {
    s = await openBrowser();
    pool = new pg.Pool({ connectionString: process.env.E2E_DATABASE_URL, max: 2 });
    fixtures = await createAccessFixtures(pool);
    tokens = await createSessions(pool);
    // Every violation the page reports, from the first script on.
    await s.context.addInitScript(() => {
      const seen: string[] = [];
      (window as unknown as { __cspViolations: string[] }).__cspViolations = seen;
      document.addEventListener("securitypolicyviolation", (e) => seen.push(`${e.violatedDirective} ${e.blockedURI}`));
    });
  });

  afterAll(async () => {
    await s?.close();
    if (fixtures) await removeAccessFixtures(pool, fixtures);
    if (tokens) await removeSessions(pool, tokens);
    await pool?.end();
  });

  const violations = () => s.page.evaluate(() => (window as unknown as { __cspViolations: string[] }).__cspViolations);

  it("refuses to be framed by another site (frame-ancestors 'none')", async () => {
    const site = await otherSite();
    try {
      const refusals: string[] = [];
      s.page.on("console", (m) => {
        if (m.text().includes("frame-ancestors")) refusals.push(m.text());
      });
      await s.page.goto(site.url);
      await s.page.evaluate((src) => {
        const frame = document.createElement("iframe");
        frame.src = src;
        document.body.append(frame);
      }, `${BASE_URL}/catalog`);
      await expect.poll(() => refusals.length).toBeGreaterThan(0);
      expect(refusals[0]).toMatch(/frame-ancestors 'none'/);
      // The frame is left empty (Chromium's error page); the catalog never renders inside it.
      const child = s.page.frames().find((f) => f !== s.page.mainFrame());
      expect(child, "the iframe exists").toBeDefined();
      expect(child!.url()).not.toBe(`${BASE_URL}/catalog`);
    } finally {
      await site.close();
    }
  });

  it("blocks an image from a host the policy does not name, and reports it (the listener works)", async () => {
    await s.page.goto("/catalog");
    await s.page.evaluate(() => {
      const img = document.createElement("img");
      img.src = "http://evil.example/pixel.png";
      document.body.append(img);
    });
    await expect.poll(violations).toEqual(expect.arrayContaining([expect.stringMatching(/^img-src http:\/\/evil\.example/)]));
  });

  it("opens every page a seller, a member and an admin can open without a single violation", { timeout: 600_000 }, async () => {
    const origin = new URL(BASE_URL);
    const found: string[] = [];
    for (const persona of ["sellerOwner", "member", "admin"] as const) {
      await s.context.clearCookies();
      await s.context.addCookies([{ name: SESSION_COOKIE, value: tokens[persona], domain: origin.hostname, path: "/", httpOnly: true, sameSite: "Lax" }]);
      for (const entry of PAGES.filter((p) => p.expect[persona] === "ok")) {
        const path = fillPath(entry.path, fixtures);
        await s.page.goto(path, { waitUntil: "load" });
        // Client components hydrate and fetch (catalog search, live checks) just after load.
        await s.page.waitForTimeout(400);
        const seen = await violations();
        if (seen.length) found.push(`${persona} ${path}: ${seen.join(", ")}`);
      }
    }
    expect(found).toEqual([]);
  });
});

describe("the session cookie", () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(async () => {
    await s?.close();
  });

  it("is HttpOnly and SameSite=Lax, and on this http address not Secure (no script can read it)", async () => {
    await signInThroughOutbox(s.page, "noor.builds@larkspur.test", "/account");
    const cookie = (await s.context.cookies(BASE_URL)).find((c) => c.name === SESSION_COOKIE);
    expect(cookie, `a ${SESSION_COOKIE} cookie`).toBeDefined();
    expect(cookie).toMatchObject({ httpOnly: true, sameSite: "Lax", secure: false, path: "/" });
    expect(await s.page.evaluate(() => document.cookie)).not.toContain(SESSION_COOKIE);
  });
});

describe("where the sign-in page sends someone already signed in", () => {
  let pool: pg.Pool;
  let tokens: Record<Exclude<Persona, "visitor">, string>;
  beforeAll(async () => {
    pool = new pg.Pool({ connectionString: process.env.E2E_DATABASE_URL, max: 1 });
    tokens = await createSessions(pool);
  });
  afterAll(async () => {
    if (tokens) await removeSessions(pool, tokens);
    await pool?.end();
  });

  // The WHATWG URL parser (what a browser applies to Location) reads "\" as "/" and drops tabs:
  // each of these would be an open redirect to evil.example if passed through.
  for (const next of ["//evil.example", "/\\evil.example", "/\t/evil.example", "https://evil.example/"]) {
    it(`stays on this site for next=${JSON.stringify(next)}`, async () => {
      const res = await fetch(`${BASE_URL}/sign-in?next=${encodeURIComponent(next)}`, {
        redirect: "manual",
        headers: { cookie: `${SESSION_COOKIE}=${tokens.member}` },
      });
      await res.body?.cancel();
      expect(res.status).toBeGreaterThanOrEqual(300);
      const location = res.headers.get("location") ?? "";
      expect(new URL(location, BASE_URL).origin).toBe(new URL(BASE_URL).origin);
      expect(new URL(location, BASE_URL).pathname).toBe("/account");
    });
  }

  it("still follows a path of this site", async () => {
    const res = await fetch(`${BASE_URL}/sign-in?next=${encodeURIComponent("/questions/new?listing=x")}`, { redirect: "manual", headers: { cookie: `${SESSION_COOKIE}=${tokens.member}` } });
    await res.body?.cancel();
    expect(res.headers.get("location")).toBe("/questions/new?listing=x");
  });
});

describe("a server action posted from another site", () => {
  /** The sign-in form as the page serves it before any script runs: its hidden action fields. */
  async function signInFormFields(): Promise<[string, string][]> {
    const html = await (await fetch(`${BASE_URL}/sign-in`)).text();
    const form = html.match(/<form[^>]*>([\s\S]*?)<\/form>/)?.[1] ?? "";
    const fields = [...form.matchAll(/<input[^>]*type="hidden"[^>]*>/g)].flatMap(([tag]) => {
      const name = tag.match(/name="([^"]*)"/)?.[1];
      const value = (tag.match(/value="([^"]*)"/)?.[1] ?? "").replaceAll("&quot;", '"').replaceAll("&amp;", "&");
      return name ? [[name, value] as [string, string]] : [];
    });
    expect(fields.some(([name]) => name.startsWith("$ACTION")), "the form carries its action id").toBe(true);
    return fields;
  }

  async function post(origin: string, email: string): Promise<Response> {
    const body = new FormData();
    for (const [name, value] of await signInFormFields()) body.append(name, value);
    body.append("email", email);
    return fetch(`${BASE_URL}/sign-in`, { method: "POST", body, redirect: "manual", headers: { origin } });
  }

  it("is refused before it runs (no link is sent), while the same post from this site signs in", async () => {
    const tag = randomBytes(3).toString("hex");
    const attacked = `cross.site.${tag}@example.test`;
    const since = new Date(Date.now() - 1000);
    const refused = await post("http://evil.example", attacked);
    await refused.body?.cancel();
    expect(refused.status).toBeGreaterThanOrEqual(400);

    const control = `same.site.${tag}@example.test`;
    const accepted = await post(new URL(BASE_URL).origin, control);
    await accepted.body?.cancel();
    expect(accepted.status).toBe(303);
    expect(accepted.headers.get("location")).toContain("/sign-in/check-email");
    await waitForMessage(control, since);
    // The control's mail arrived, so the refused one would have too by now.
    expect(await messagesTo(attacked)).toEqual([]);
  });

  const sites: { close(): Promise<void> }[] = [];
  afterAll(async () => {
    for (const site of sites) await site.close();
  });

  it("is refused when Chromium submits it from a page of another site", async () => {
    const s = await openBrowser();
    try {
      const attacked = `cross.site.browser.${randomBytes(3).toString("hex")}@example.test`;
      const fields = await signInFormFields();
      const site = await otherSite();
      sites.push(site);
      await s.page.goto(site.url);
      const answer = s.page.waitForResponse((r) => r.url().startsWith(`${BASE_URL}/sign-in`) && r.request().method() === "POST");
      await s.page.evaluate(
        ({ action, fields, email }) => {
          const form = document.createElement("form");
          form.method = "POST";
          form.enctype = "multipart/form-data";
          form.action = action;
          for (const [name, value] of [...fields, ["email", email]]) {
            const input = document.createElement("input");
            input.type = "hidden";
            input.name = name!;
            input.value = value!;
            form.append(input);
          }
          document.body.append(form);
          form.submit();
        },
        { action: `${BASE_URL}/sign-in`, fields, email: attacked },
      );
      const response = await answer;
      expect((await response.request().allHeaders()).origin).toBe(new URL(site.url).origin);
      expect(response.status()).toBeGreaterThanOrEqual(400);
      await new Promise((r) => setTimeout(r, 1500));
      expect(await messagesTo(attacked)).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
