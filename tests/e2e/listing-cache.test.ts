import { randomBytes } from "node:crypto";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../db/seed-data";
import { connectFixtures, ensureSellerProfile, insertListing, type FixtureDb } from "../integration/moderation/fixtures";
import { BASE_URL, openBrowser } from "./support/browser";
import { fakePaymentsClient } from "./support/payments";

// Listing pages are served from Next's cache (app/(shop)/listings/[slug]/page.tsx): the HTML is the
// same for everyone, the header learns who is signed in from GET /api/session after load, and a
// change made through the app (a moderator's hold, a stock edit) shows on the very next request.
const SESSION_COOKIE = "authjs.session-token";
const member = DEMO_ACCOUNTS.find((a) => a.id === "demo-builder")!;
const run = Date.now().toString(36);

let fixtures: { db: FixtureDb; close(): Promise<void> };
let pool: pg.Pool;
const tokens = { member: "", moderator: "", seller: "" };
let listingId = "";
let slug = "";

beforeAll(async () => {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run this through npm test");
  fixtures = connectFixtures(url);
  pool = new pg.Pool({ connectionString: url, max: 2 });
  for (const [who, userId] of [["member", "demo-builder"], ["moderator", "demo-moderator"], ["seller", "demo-seller-kits"]] as const) {
    tokens[who] = randomBytes(32).toString("hex");
    await pool.query("insert into sessions (session_token, user_id, expires) values ($1, $2, now() + interval '1 day')", [tokens[who], userId]);
  }
  await ensureSellerProfile(fixtures.db, "demo-seller-kits", "Oyelaran Bench Kits");
  listingId = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: `Cached driver kit ${run}`, state: "live" });
  slug = (await pool.query<{ slug: string }>("select slug from listings where id = $1", [listingId])).rows[0]!.slug;
});

afterAll(async () => {
  await pool?.query("delete from sessions where session_token = any($1::text[])", [Object.values(tokens).filter(Boolean)]);
  await fixtures?.close();
  await pool?.end();
});

const cookie = (token: string) => ({ cookie: `${SESSION_COOKIE}=${token}` });

async function listingPage(headers: Record<string, string> = {}, ofSlug = slug): Promise<{ html: string; cache: string | null }> {
  const res = await fetch(`${BASE_URL}/listings/${ofSlug}`, { headers });
  expect(res.status).toBe(200);
  return { html: await res.text(), cache: res.headers.get("x-nextjs-cache") };
}

/** A moderator's or seller's JSON call, with the app's own Origin as a browser sends it. */
async function call(method: "POST" | "PATCH", path: string, token: string, body: unknown): Promise<Response> {
  return fetch(`${BASE_URL}${path}`, {
    method,
    headers: { ...cookie(token), origin: new URL(BASE_URL).origin, "content-type": "application/json", accept: "application/json" },
    body: JSON.stringify(body),
  });
}

const stateOf = (html: string) => /data-testid="listing-page" data-state="([a-z_]+)"/.exec(html)?.[1];

describe("listing pages from the cache", () => {
  it("carry nobody's name or address: the same cached HTML for a member and a visitor", async () => {
    const asMember = await listingPage(cookie(tokens.member));
    const asVisitor = await listingPage();
    for (const page of [asMember, asVisitor]) {
      expect(page.html).toContain(`Cached driver kit ${run}`);
      expect(page.html).not.toContain(member.email);
      expect(page.html).not.toContain(member.name);
      expect(page.html).not.toContain('data-testid="signed-in-as"');
    }
    // The second request is answered from the cache, whoever asks.
    expect(asVisitor.cache).toBe("HIT");
    expect(asVisitor.html).toBe(asMember.html);
  });

  it("GET /api/session names the signed-in person, uncached, and nobody for a visitor", async () => {
    const signedIn = await fetch(`${BASE_URL}/api/session`, { headers: cookie(tokens.member) });
    expect(signedIn.headers.get("cache-control")).toContain("no-store");
    expect(await signedIn.json()).toEqual({ user: { label: member.name, roles: ["member"] } });
    const visitor = await fetch(`${BASE_URL}/api/session`);
    expect(await visitor.json()).toEqual({ user: null });
  });

  it("the header fills in the signed-in person after load, with their area links", async () => {
    const s = await openBrowser();
    try {
      await s.context.addCookies([{ name: SESSION_COOKIE, value: tokens.member, url: BASE_URL }]);
      await s.page.goto(`/listings/${slug}`);
      expect(await s.page.getByTestId("signed-in-as").textContent()).toBe(member.name);
      await s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "My bench" }).waitFor();
      const account = s.page.getByTestId("account-controls");
      expect(await account.getByRole("link", { name: "Sign in" }).count()).toBe(0);
      // Signing out forgets the person in the header at once, and on the server. The header's own
      // link is the one to wait for: the home page it lands on has sign-in links of its own.
      await s.page.getByRole("button", { name: "Sign out" }).click();
      await account.getByRole("link", { name: "Sign in" }).waitFor();
      await s.page.waitForURL(`${BASE_URL}/`);
      expect(await (await s.page.request.get("/api/session")).json()).toEqual({ user: null });
    } finally {
      await s.close();
    }
  });

  it("a stock edit, a moderator's hold and a restore show on the next request", async () => {
    const before = await listingPage();
    expect(before.html).toContain("4 in stock");
    expect(await listingPage().then((p) => p.cache)).toBe("HIT");

    expect((await call("PATCH", `/api/sell/listings/${listingId}/stock`, tokens.seller, { stock: 2 })).status).toBe(200);
    const restocked = await listingPage();
    expect(restocked.html).toContain("2 in stock");

    const hold = await call("POST", `/api/moderation/listings/${listingId}/hold`, tokens.moderator, { reason: "A buyer reports the bleeder resistor is missing as shipped." });
    expect(hold.status).toBe(200);
    const held = await listingPage();
    expect(stateOf(held.html)).toBe("held");
    expect(held.html).toContain("Held by a moderator");
    expect(held.html).not.toContain('data-testid="add-to-cart"');

    const restore = await call("POST", `/api/moderation/listings/${listingId}/restore`, tokens.moderator, {});
    expect(restore.status).toBe(200);
    const live = await listingPage();
    expect(stateOf(live.html)).toBe("live");
    expect(live.html).toContain('data-testid="add-to-cart"');
  });

  it("a question about the listing shows in its Q&A panel once visible, and goes when a moderator removes it", async () => {
    const title = `Does the ${run} kit ship with its bleeder resistors fitted?`;
    expect((await listingPage()).html).not.toContain(title);
    // A session of its own: the header test before this one signs the member out.
    const asker = randomBytes(32).toString("hex");
    await pool.query("insert into sessions (session_token, user_id, expires) values ($1, $2, now() + interval '1 day')", [asker, member.id]);
    const asked = await call("POST", "/api/questions", asker, { title, bodyMd: "The bus capacitors should drain on their own once it is unplugged.", listingId });
    expect(asked.status).toBe(201);
    const question = (await asked.json()) as { id: string; state: string };
    // A member without enough approved posts waits for a moderator; either way the page follows.
    if (question.state === "pending") {
      expect((await listingPage()).html).not.toContain(title);
      expect((await call("POST", `/api/posts/question/${question.id}/approve`, tokens.moderator, {})).status).toBe(200);
    }
    expect((await listingPage()).html).toContain(title);
    const removed = await call("POST", `/api/posts/question/${question.id}/remove`, tokens.moderator, { reason: "Asked again below, with the photos." });
    expect(removed.status).toBe(200);
    expect((await listingPage()).html).not.toContain(title);
    await pool.query("delete from sessions where session_token = $1", [asker]);
  });

  it("a seller cancelling a paid order puts its stock back on the listing page at once", async () => {
    // A listing of its own with a paid order for one unit, written into the tables beside a payment
    // made in the payments fake, so that the cancel's refund goes through.
    const otherId = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: `Cancelled order kit ${run}`, state: "live" });
    const otherSlug = (await pool.query<{ slug: string }>("select slug from listings where id = $1", [otherId])).rows[0]!.slug;
    const stripe = fakePaymentsClient();
    const intent = await stripe.paymentIntents.create({ amount: 14_900, currency: "eur", confirm: true, payment_method: "pm_card_visa", allowed_payment_method_types: ["card"] });
    const checkout = await pool.query<{ id: string }>(
      `insert into checkouts (buyer_id, email, currency, total_minor, fee_bps, status, payment_intent_id, expires_at, paid_at)
       values ($1, $2, 'EUR', 14900, 800, 'paid', $3, now() + interval '1 hour', now()) returning id`,
      [member.id, member.email, intent.id],
    );
    const order = await pool.query<{ id: string }>(
      `insert into orders (number, checkout_id, buyer_id, seller_id, state, currency, subtotal_minor, fee_minor, seller_share_minor, paid_at)
       values ($1, $2, $3, 'demo-seller-kits', 'paid', 'EUR', 14900, 1192, 13708, now()) returning id`,
      [`FY-C-${run.toUpperCase()}`, checkout.rows[0]!.id, member.id],
    );
    await pool.query("insert into order_lines (order_id, listing_id, title, unit_price_minor, quantity, sheet_revision) values ($1, $2, $3, 14900, 1, 1)", [
      order.rows[0]!.id,
      otherId,
      `Cancelled order kit ${run}`,
    ]);
    const page = () => listingPage({}, otherSlug);
    expect((await page()).html).toContain("4 in stock");
    expect((await page()).cache).toBe("HIT");

    const cancelled = await call("POST", `/api/orders/${order.rows[0]!.id}/cancel`, tokens.seller, {});
    expect(cancelled.status).toBe(200);
    expect((await pool.query("select state from orders where id = $1", [order.rows[0]!.id])).rows[0]).toEqual({ state: "cancelled" });
    expect((await page()).html).toContain("5 in stock");
  });

  it("a hold from the moderator's review page (the server action) takes it off sale at once", async () => {
    expect(stateOf((await listingPage()).html)).toBe("live");
    const s = await openBrowser();
    try {
      await s.context.addCookies([{ name: SESSION_COOKIE, value: tokens.moderator, url: BASE_URL }]);
      await s.page.goto(`/moderate/listings/${listingId}`);
      await s.page.getByLabel("Why is it held?").fill("The stored-charge note gives no wait time after unplugging.");
      await s.page.getByRole("button", { name: "Hold the listing" }).click();
      await s.page.waitForURL(/done=hold/);
    } finally {
      await s.close();
    }
    const held = await listingPage();
    expect(stateOf(held.html)).toBe("held");
    expect(held.html).not.toContain('data-testid="add-to-cart"');
  });
});
