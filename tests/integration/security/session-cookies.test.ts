// The session cookie Auth.js sets when a sign-in link is followed, read off the real callback route
// against the real database. RFC 6265bis: HttpOnly keeps it from scripts, SameSite=Lax keeps it off
// other sites' POSTs and subrequests, Secure keeps it off plain http; the "__Secure-" prefix
// (RFC 6265bis §4.1.3.1) makes browsers refuse it unless it is Secure and set over https.
import { createHash, randomBytes } from "node:crypto";
import { NextRequest } from "next/server";
import pg from "pg";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { seedDemo } from "@/db/seed";
import { freshDatabase } from "../../support/test-database";
import "./next-auth-loader";

// The cart merge at sign-in reads the visitor's cart cookie through next/headers, which exists only
// inside a Next request; the cookie under test is Auth.js's own.
vi.mock("@/lib/checkout/cart-owner", () => ({ mergeCartAtSignIn: async () => {} }));

const SECRET = "session-cookie-test-secret-0123456789abcdef";
const EMAIL = "noor.builds@larkspur.test";
let database: { url: string; drop(): Promise<void> };
let pool: pg.Pool;

beforeAll(async () => {
  database = await freshDatabase("security_cookies");
  await seedDemo(database.url);
  pool = new pg.Pool({ connectionString: database.url, max: 2 });
  process.env.DATABASE_URL = database.url;
  process.env.AUTH_SECRET = SECRET;
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool?.end();
  await database?.drop();
});

beforeEach(async () => {
  delete process.env.AUTH_URL;
  (await import("@/lib/env"))._resetEnvForTests();
});

/** A sign-in link as the e-mail provider stores it: the database keeps sha256(token + secret). */
async function signInLink(base: string): Promise<string> {
  const token = randomBytes(32).toString("hex");
  const hashed = createHash("sha256").update(`${token}${SECRET}`).digest("hex");
  await pool.query("insert into verification_tokens (identifier, token, expires) values ($1, $2, now() + interval '30 minutes')", [EMAIL, hashed]);
  return `${base}/api/auth/callback/resend?token=${token}&email=${encodeURIComponent(EMAIL)}`;
}

async function followLink(appUrl: string, authUrl: string | undefined, requestBase: string) {
  process.env.APP_URL = appUrl;
  if (authUrl) process.env.AUTH_URL = authUrl;
  (await import("@/lib/env"))._resetEnvForTests();
  const { handlers } = await import("@/lib/auth/config");
  const url = await signInLink(requestBase);
  const res = await handlers.GET(new NextRequest(url, { headers: { host: new URL(requestBase).host } }));
  const setCookies = res.headers.getSetCookie();
  const session = setCookies.find((c) => /^(__Secure-)?authjs\.session-token=/.test(c));
  expect(res.status, `the callback answered ${res.status}; cookies: ${setCookies.join(" | ")}`).toBeLessThan(400);
  expect(session, `a session cookie among: ${setCookies.join(" | ")}`).toBeDefined();
  const attributes = session!.split(";").map((a) => a.trim().toLowerCase());
  const value = session!.split(";")[0]!.split("=").slice(1).join("=");
  const { rows } = await pool.query("select user_id from sessions where session_token = $1", [value]);
  return { cookie: session!, attributes, userId: rows[0]?.user_id as string | undefined };
}

describe("the session cookie", () => {
  it("with AUTH_URL on https: __Secure- prefixed, Secure, HttpOnly, SameSite=Lax", async () => {
    const { cookie, attributes, userId } = await followLink("https://fluxyard.example", "https://fluxyard.example", "https://fluxyard.example");
    expect(cookie.startsWith("__Secure-authjs.session-token=")).toBe(true);
    expect(attributes).toEqual(expect.arrayContaining(["secure", "httponly", "samesite=lax", "path=/"]));
    // The cookie names a real database session of the person who followed the link.
    expect(userId).toBe("demo-builder");
  });

  it("behind a proxy that forwards no protocol (the app sees http), still Secure because the public address is https", async () => {
    const { cookie, attributes } = await followLink("https://fluxyard.example", undefined, "http://10.0.0.7:3000");
    expect(cookie.startsWith("__Secure-authjs.session-token=")).toBe(true);
    expect(attributes).toContain("secure");
    expect(attributes).toContain("httponly");
  });

  it("on a local http address: not Secure (a browser would drop it), but still HttpOnly and SameSite=Lax", async () => {
    const { cookie, attributes } = await followLink("http://localhost:3000", "http://localhost:3000", "http://localhost:3000");
    expect(cookie.startsWith("authjs.session-token=")).toBe(true);
    expect(attributes).not.toContain("secure");
    expect(attributes).toEqual(expect.arrayContaining(["httponly", "samesite=lax"]));
  });
});
