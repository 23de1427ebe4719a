// The sign-in form's server action against the real PostgreSQL rate-limit windows: per address and
// per client address, fixed windows (lib/rate-limit), a message that says when to try again, and no
// link sent once refused. Auth.js's signIn (which e-mails the link) is replaced by a recorder: it is
// the only way the action sends mail, so "not called" is "nothing sent".
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { freshDatabase } from "../../support/test-database";

const state = vi.hoisted(() => ({ headers: {} as Record<string, string>, sent: [] as string[] }));
vi.mock("@/lib/auth/config", () => ({
  auth: async () => null,
  signOut: async () => {},
  signIn: async (_provider: string, options: { email: string }) => {
    state.sent.push(options.email);
    return undefined;
  },
}));
vi.mock("next/headers", () => ({ headers: async () => new Headers(state.headers) }));

let database: { url: string; drop(): Promise<void> };
let limits: typeof import("@/lib/rate-limit/sign-in");

beforeAll(async () => {
  database = await freshDatabase("security_sign_in_limits");
  process.env.DATABASE_URL = database.url;
  (await import("@/lib/env"))._resetEnvForTests();
  limits = await import("@/lib/rate-limit/sign-in");
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await database?.drop();
});

beforeEach(async () => {
  // Fixed windows start at multiples of 15 minutes; a case that ran across one would see two windows.
  const intoWindow = (Date.now() / 1000) % limits.SIGN_IN_WINDOW_SECONDS;
  if (intoWindow > limits.SIGN_IN_WINDOW_SECONDS - 20) await new Promise((r) => setTimeout(r, (limits.SIGN_IN_WINDOW_SECONDS - intoWindow + 1) * 1000));
  state.sent = [];
  state.headers = {};
  const { db } = await import("@/db/client");
  const { rateLimits } = await import("@/db/schema");
  await db.delete(rateLimits);
});

/** Submits the form once; "sent" when the action went on to the check-email page. */
async function ask(email: string, from?: string): Promise<{ sent: true } | { sent: false; message: string }> {
  state.headers = from ? { "x-forwarded-for": from } : {};
  const { requestSignInLink } = await import("@/app/(account)/sign-in/actions");
  const form = new FormData();
  form.set("email", email);
  try {
    const result = await requestSignInLink(null, form);
    if (result.ok) throw new Error("the action returned ok without redirecting");
    return { sent: false, message: result.message };
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (digest.startsWith("NEXT_REDIRECT") && digest.includes("/sign-in/check-email")) return { sent: true };
    throw error;
  }
}

describe("sign-in links per address", () => {
  it(`sends ${10} links in a window, then refuses with when to come back, and sends nothing more`, async () => {
    expect(limits.LINKS_PER_ADDRESS).toBe(10);
    for (let i = 0; i < limits.LINKS_PER_ADDRESS; i++) expect(await ask("noor.builds@larkspur.test", "203.0.113.7")).toEqual({ sent: true });
    const refused = await ask("noor.builds@larkspur.test", "203.0.113.8");
    expect(refused.sent).toBe(false);
    if (!refused.sent) expect(refused.message).toMatch(/10 sign-in links in this quarter of an hour.*ask for another in \d+ (minutes|seconds?) \(at \d\d:\d\d UTC\)/);
    expect(state.sent).toHaveLength(limits.LINKS_PER_ADDRESS);
  });

  it("counts the address however it is capitalised or padded (one inbox, one window)", async () => {
    for (let i = 0; i < limits.LINKS_PER_ADDRESS; i++) await ask(i % 2 ? "Noor.Builds@Larkspur.test" : "  noor.builds@larkspur.test ");
    expect((await ask("NOOR.BUILDS@LARKSPUR.TEST")).sent).toBe(false);
  });

  it("leaves other addresses alone", async () => {
    for (let i = 0; i < limits.LINKS_PER_ADDRESS + 1; i++) await ask("sefa.moderator@larkspur.test");
    expect(await ask("oriel.admin@larkspur.test")).toEqual({ sent: true });
  });

  it("is a fixed window: once it has passed, links are sent again", async () => {
    for (let i = 0; i < limits.LINKS_PER_ADDRESS + 1; i++) await ask("tamsin.reviews@larkspur.test");
    expect((await ask("tamsin.reviews@larkspur.test")).sent).toBe(false);
    // Age the window past its end, as the clock would.
    const { db } = await import("@/db/client");
    const { sql } = await import("drizzle-orm");
    await db.execute(sql`update rate_limits set window_start = window_start - interval '1 hour' where key like 'sign-in:address:%'`);
    expect(await ask("tamsin.reviews@larkspur.test")).toEqual({ sent: true });
  });

  it("does not count a mistyped address (it never reaches the limiter)", async () => {
    const form = new FormData();
    form.set("email", "noor.at.larkspur");
    const { requestSignInLink } = await import("@/app/(account)/sign-in/actions");
    expect(await requestSignInLink(null, form)).toMatchObject({ ok: false, fieldErrors: { email: [expect.any(String)] } });
    const { db } = await import("@/db/client");
    const { rateLimits } = await import("@/db/schema");
    expect(await db.select().from(rateLimits)).toEqual([]);
  });
});

describe("sign-in links per client address", () => {
  it(`takes ${30} requests from one network in a window, whatever the addresses, then refuses that network only`, async () => {
    expect(limits.LINKS_PER_CLIENT).toBe(30);
    for (let i = 0; i < limits.LINKS_PER_CLIENT; i++) expect(await ask(`visitor.${i}@example.test`, "198.51.100.4")).toEqual({ sent: true });
    const refused = await ask("visitor.extra@example.test", "198.51.100.4");
    expect(refused.sent).toBe(false);
    if (!refused.sent) expect(refused.message).toMatch(/Your network has asked for 30 sign-in links.*You can ask again in \d+ (minutes|seconds?) \(at \d\d:\d\d UTC\)/);
    expect(state.sent).not.toContain("visitor.extra@example.test");
    // Another network is not held up.
    expect(await ask("visitor.extra@example.test", "192.0.2.10")).toEqual({ sent: true });
  });

  it("takes the nearest proxy's entry of X-Forwarded-For, so a forged first entry changes nothing", async () => {
    for (let i = 0; i < limits.LINKS_PER_CLIENT; i++) await ask(`forger.${i}@example.test`, `10.${i}.0.1, 198.51.100.77`);
    expect((await ask("forger.last@example.test", "10.99.0.1, 198.51.100.77")).sent).toBe(false);
  });

  it("does not lump every visitor together when the app only sees this machine (loopback: a local run or a proxy that forwards nothing)", async () => {
    for (let i = 0; i < limits.LINKS_PER_CLIENT + 5; i++) expect(await ask(`local.${i}@example.test`, "::ffff:127.0.0.1")).toEqual({ sent: true });
  });
});

describe("clientAddress", () => {
  it("reads the last forwarded entry, strips the IPv4-mapped prefix, and gives null for loopback or nothing", () => {
    expect(limits.clientAddress("203.0.113.1, 198.51.100.2")).toBe("198.51.100.2");
    expect(limits.clientAddress("::ffff:203.0.113.9")).toBe("203.0.113.9");
    expect(limits.clientAddress(null, " 2001:db8::1 ")).toBe("2001:db8::1");
    expect(limits.clientAddress("127.0.0.1")).toBeNull();
    expect(limits.clientAddress("::1")).toBeNull();
    expect(limits.clientAddress(null)).toBeNull();
  });
});
