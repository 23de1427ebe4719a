// Fault: two `next start` instances of one build against one database, as behind a load balancer —
// the provider's webhooks go to both, and people on different instances act at the same moment.
// The last unit is sold once, and a review booking is recorded, accepted, delivered and captured once.
// In Chromium against a stack of its own (tests/e2e/support/stack.ts). Run alone with
// `FLUXYARD_TEST_SLOT=N npm test -- --e2e-only tests/e2e/faults/two-instances.test.ts`.
import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, expect, it } from "vitest";
import { openBrowser, screenshot, type Session } from "../support/browser";
import {
  addToCart,
  browserSessionCookies,
  eventually,
  fakeMessages,
  liveListing,
  raceAtLock,
  sessionCookieHeader,
  signedIn,
  startStack,
  type FaultStack,
  type Member,
} from "../support/stack";

const BUILDER = { id: "demo-builder", email: "noor.builds@larkspur.test" };
const REVIEWER = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test" };
const DEMO_KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001";

let stack: FaultStack;
const sessions: Session[] = [];

beforeAll(async () => {
  stack = await startStack({ label: "two-instances", apps: 2 });
});

afterAll(async () => {
  for (const s of sessions) await s.close().catch(() => {});
  await stack?.stop();
});

async function browserFor(member: Member): Promise<Session> {
  const session = await openBrowser();
  sessions.push(session);
  await session.context.addCookies(browserSessionCookies(member.token));
  return session;
}

/** What a form submission came to: the page it leads to, or the message the form shows instead. */
async function outcomeOf(page: Page, success: RegExp): Promise<{ kind: "done" } | { kind: "refused"; message: string }> {
  const message = page.locator("[aria-live] p").first();
  return Promise.race([
    page.waitForURL(success, { timeout: 30_000 }).then(() => ({ kind: "done" as const })),
    message.waitFor({ timeout: 30_000 }).then(async () => ({ kind: "refused" as const, message: (await message.textContent()) ?? "" })),
  ]);
}

async function auditCount(action: string, subjectId: string): Promise<number> {
  const { rows } = await stack.db.query("select count(*)::int as n from audit_log where action = $1 and subject_id = $2", [action, subjectId]);
  return rows[0].n;
}

it("two buyers on two instances race for the last unit: one checkout holds it, one order is paid, once, though both instances get the webhooks", async () => {
  const [appA, appB] = stack.appUrls as [string, string];
  const first = await signedIn(stack, { email: "race.first@example.test" });
  const second = await signedIn(stack, { email: "race.second@example.test" });
  const pages = [(await browserFor(first)).page, (await browserFor(second)).page] as const;
  const members = [first, second] as const;

  let paidListing: string | null = null;
  for (let round = 0; round < 2; round++) {
    const listing = await liveListing(stack, { stock: 1, priceMinor: 5_200, title: `Last unit choke round ${round + 1}` });
    // Each buyer on their own instance; the instances swap every round.
    const apps = round % 2 === 0 ? ([appA, appB] as const) : ([appB, appA] as const);
    for (const i of [0, 1] as const) await addToCart(apps[i], members[i].token, listing.id);
    for (const i of [0, 1] as const) {
      await pages[i].goto(`${apps[i]}/checkout`);
      await pages[i].getByRole("button", { name: "Pay €52.00" }).waitFor();
    }
    // Both checkouts are inside their transactions, at the stock update, before either may go on.
    await raceAtLock(stack, "select 1 from listings where id = $1 for update", [listing.id], 2, () =>
      Promise.all(pages.map((p) => p.getByRole("button", { name: "Pay €52.00" }).click())),
    );
    const outcomes = await Promise.all(pages.map((p) => outcomeOf(p, /\/pay\/cs_/)));
    expect(outcomes.map((o) => o.kind).sort()).toEqual(["done", "refused"]);
    const refused = outcomes.find((o) => o.kind === "refused") as { message: string };
    expect(refused.message).toMatch(/someone else bought it first|Not enough stock/);
    const { rows } = await stack.db.query(
      "select c.status, r.status as reservation from stock_reservations r join checkouts c on c.id = r.checkout_id where r.listing_id = $1",
      [listing.id],
    );
    expect(rows).toEqual([{ status: "open", reservation: "held" }]);
    expect((await stack.db.query("select stock from listings where id = $1", [listing.id])).rows[0].stock).toBe(0);
    const winner = outcomes.findIndex((o) => o.kind === "done") as 0 | 1;
    const loser = winner === 0 ? 1 : 0;
    if (round === 0) {
      await screenshot(pages[loser], "faults-two-instances-01-race-lost");
      const page = pages[winner];
      await page.getByLabel("Card number").fill("4242 4242 4242 4242");
      await page.getByRole("button", { name: /^Pay / }).click();
      await page.waitForURL(/\/checkout\/done\?session=/);
      await page.locator('[data-testid="payment-status"][data-status="paid"]').waitFor({ timeout: 30_000 });
      paidListing = listing.id;
    }
    // Both take this round's line out of their carts (the loser's is sold out, the winner's unpaid one
    // is held by its own checkout), so the next round starts from one line each.
    for (const i of [0, 1] as const) {
      await fetch(`${apps[i]}/api/cart`, {
        method: "DELETE",
        headers: { "content-type": "application/json", cookie: sessionCookieHeader(members[i].token), origin: apps[i] },
        body: JSON.stringify({ listingId: listing.id }),
      });
    }
  }

  // Both instances received every event of the paid checkout; each was applied once.
  const { rows: paid } = await stack.db.query(
    "select o.id, o.state, c.id as checkout_id, u.email from orders o join checkouts c on c.id = o.checkout_id join order_lines l on l.order_id = o.id join users u on u.id = o.buyer_id where l.listing_id = $1 and o.state = 'paid'",
    [paidListing],
  );
  expect(paid).toHaveLength(1);
  const deliveries = (await (await fetch(`${stack.paymentsUrl}/api/test/deliveries?type=checkout.session.completed`)).json()) as { deliveries: { endpoint: string; status: string }[] };
  const endpoints = new Set(deliveries.deliveries.filter((d) => d.status === "succeeded").map((d) => new URL(d.endpoint).origin));
  expect(endpoints).toEqual(new Set([new URL(appA).origin, new URL(appB).origin]));
  await eventually("the seller's share transferred", async () => (await stack.db.query("select transfer_id from orders where id = $1", [paid[0].id])).rows[0].transfer_id);
  const transfers = await stack.stripe.transfers.list({ transfer_group: paid[0].checkout_id, limit: 10 });
  expect(transfers.data).toHaveLength(1);
  const receipts = await eventually("the receipt", async () => {
    const found = (await fakeMessages(stack)).filter((m) => m.to.includes(paid[0].email) && m.subject.startsWith("Paid:"));
    return found.length > 0 ? found : undefined;
  });
  await new Promise((r) => setTimeout(r, 1_000));
  expect((await fakeMessages(stack)).filter((m) => m.to.includes(paid[0].email) && m.subject.startsWith("Paid:"))).toHaveLength(receipts.length);
  expect(receipts).toHaveLength(1);
}, 150_000);

it("a review booked on one instance, accepted and delivered from both at once, is recorded, accepted, delivered and captured once", async () => {
  const [appA, appB] = stack.appUrls as [string, string];
  const builder = await signedIn(stack, BUILDER);
  const reviewer = await signedIn(stack, REVIEWER);
  await stack.db.query("update reviewer_profiles set price_minor = 4500, available = true where user_id = $1", [REVIEWER.id]);
  const logTitle = `Two-instance bring-up (${randomUUID().slice(0, 8)})`;
  const { rows } = await stack.db.query("insert into bring_up_logs (owner_id, kit_listing_id, title, notes_md) values ($1, $2, $3, $4) returning id", [
    BUILDER.id,
    DEMO_KIT_ID,
    logTitle,
    "Built from the kit; series lamp 100 W.",
  ]);
  await stack.db.query(
    `insert into log_checkpoints (log_id, source_checkpoint_id, position, stage, name, measure, unit, expected_min, expected_max)
     select $1, id, position, stage, name, measure, unit, expected_min, expected_max from listing_checkpoints where listing_id = $2`,
    [rows[0].id, DEMO_KIT_ID],
  );

  // Booked on A; the builder's return lands on A while the provider's events reach A and B.
  const b = (await browserFor(builder)).page;
  await b.goto(`${appA}/reviews/new?reviewer=${REVIEWER.id}`);
  await b.getByLabel("Bring-up log").selectOption({ label: logTitle });
  await b.getByLabel(/^Low-current load/).uncheck();
  await b.getByLabel(/^Rated load/).uncheck();
  await b.getByRole("button", { name: "Pay €45.00 and send the request" }).click();
  await b.waitForURL(/\/pay\/cs_/);
  await b.getByLabel("Card number").fill("4242 4242 4242 4242");
  // The builder's return on A and the completed event try to record the booking at once. (The event
  // reaches both instances; the one that records its id first handles it, the other answers "duplicate".)
  await raceAtLock(stack, "select 1 from bring_up_logs where id = $1 for update", [rows[0].id], 2, () => b.getByRole("button", { name: /^Pay / }).click());
  await b.waitForURL(/\/reviews\/[0-9a-f-]{36}\?booked=1$/, { timeout: 30_000 });
  const sessionId = /\/reviews\/([0-9a-f-]{36})/.exec(b.url())![1]!;
  const completed = (await stack.stripe.events.list({ type: "checkout.session.completed", limit: 100 })).data.find(
    (e) => (e.data.object as { metadata?: Record<string, string> }).metadata?.reviewSessionId === sessionId,
  );
  expect(completed).toBeDefined();
  await eventually("both instances to have had the completed event", async () => {
    const found = (await (await fetch(`${stack.paymentsUrl}/api/test/deliveries?event_id=${completed!.id}`)).json()) as { deliveries: { status: string }[] };
    return found.deliveries.filter((d) => d.status === "succeeded").length === 2;
  });
  const { rows: booked } = await stack.db.query("select id, state, payment_intent_id, price_minor, reviewer_share_minor from review_sessions where log_id = $1", [rows[0].id]);
  expect(booked).toHaveLength(1);
  expect(booked[0]).toMatchObject({ id: sessionId, state: "requested", price_minor: 4500 });
  expect(await auditCount("review.booked", sessionId)).toBe(1);
  const intentId = booked[0].payment_intent_id as string;

  // The reviewer has the session open on both instances and accepts on both at once.
  const onA = (await browserFor(reviewer)).page;
  const onB = await onA.context().newPage();
  for (const [page, app] of [[onA, appA], [onB, appB]] as const) {
    await page.goto(`${app}/reviews/${sessionId}`);
    await page.getByRole("button", { name: "Accept the request" }).waitFor();
  }
  await raceAtLock(stack, "select 1 from review_sessions where id = $1 for update", [sessionId], 2, () =>
    Promise.all([onA, onB].map((p) => p.getByRole("button", { name: "Accept the request" }).click())),
  );
  const accepted = await Promise.all([onA, onB].map((p) => outcomeOf(p, /\?done=accepted$/)));
  expect(accepted.map((o) => o.kind).sort()).toEqual(["done", "refused"]);
  expect(await auditCount("review.accepted", sessionId)).toBe(1);

  // Then fills the report in both and delivers both at once.
  for (const [page, app] of [[onA, appA], [onB, appB]] as const) {
    await page.goto(`${app}/reviews/${sessionId}/report`);
    const checkpoints = page.getByTestId("report-checkpoint");
    await checkpoints.first().waitFor();
    const count = await checkpoints.count();
    for (let i = 0; i < count; i++) await checkpoints.nth(i).getByRole("radio", { name: /^Fine/ }).check();
    await page.getByLabel("Summary").fill("Control supply and lamp test look right; go on to the low-current load.");
  }
  await raceAtLock(stack, "select 1 from review_sessions where id = $1 for update", [sessionId], 2, () =>
    Promise.all([onA, onB].map((p) => p.getByRole("button", { name: "Deliver the report" }).click())),
  );
  const delivered = await Promise.all([onA, onB].map((p) => outcomeOf(p, /\?done=delivered$/)));
  expect(delivered.map((o) => o.kind).sort()).toEqual(["done", "refused"]);
  await screenshot(delivered[0]!.kind === "refused" ? onA : onB, "faults-two-instances-02-second-delivery-refused");

  // Captured once at the provider, the reviewer's share sent once.
  expect(await auditCount("review.delivered", sessionId)).toBe(1);
  await eventually("the capture recorded", async () => (await auditCount("review.payment_captured", sessionId)) === 1);
  const intent = await stack.stripe.paymentIntents.retrieve(intentId);
  expect(intent).toMatchObject({ status: "succeeded", amount_received: 4500, amount_capturable: 0 });
  const captures = (await stack.stripe.events.list({ type: "charge.captured", limit: 100 })).data.filter(
    (e) => (e.data.object as { payment_intent?: string }).payment_intent === intentId,
  );
  expect(captures).toHaveLength(1);
  await eventually("the reviewer's share sent", async () => (await auditCount("review.share_transferred", sessionId)) === 1);
  const transfers = await stack.stripe.transfers.list({ transfer_group: `review-${sessionId}`, limit: 10 });
  expect(transfers.data.map((t) => t.amount)).toEqual([booked[0].reviewer_share_minor]);
  const requests = (await fakeMessages(stack)).filter((m) => m.to.includes(REVIEWER.email) && m.subject === `Review request: “${logTitle}”`);
  expect(requests).toHaveLength(1);
}, 150_000);
