// A builder books a paid review of a bring-up log and the reviewer delivers it, in Chromium against the
// production build, the payments fake (its hosted page, manual capture) and the mail outbox. Run alone with
// `FLUXYARD_TEST_SLOT=9 npm test -- --e2e-only tests/e2e/reviews.test.ts`.
import { randomUUID } from "node:crypto";
import pg from "pg";
import type Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { firstLink, waitForMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";
import { fakePaymentsClient, PAYMENTS_URL } from "./support/payments";

const DATABASE_URL = process.env.E2E_DATABASE_URL ?? "";
const BUILDER = { id: "demo-builder", email: "noor.builds@larkspur.test" };
const REVIEWER = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test", name: "Tamsin Achterberg" };
const DEMO_KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001";

let pool: pg.Pool;
let stripe: Stripe;
let reviewerAccount: string;
let sessionId = "";
let intentId = "";
const run = randomUUID().slice(0, 8);
const logTitle = `Welder first bring-up (${run})`;

// Invented readings in each checkpoint's own unit (the demo kit's ranges in db/seed-listings.ts):
// 40.2 kHz and 120 mA sit within 38–42 kHz and 80–150 mA; a 52 % duty cycle is above 40–48 % (high).
const READINGS: { checkpoint: string; value: number; unit: string; verdict: "within" | "low" | "high"; note: string }[] = [
  { checkpoint: "Gate-drive frequency", value: 40.2, unit: "kHz", verdict: "within", note: "Steady on the scope." },
  { checkpoint: "Gate-drive duty cycle", value: 52, unit: "%", verdict: "high", note: "Both gates overlap near the edges?" },
  { checkpoint: "Control supply current", value: 120, unit: "mA", verdict: "within", note: "" },
  { checkpoint: "Bus voltage behind the lamp", value: 318, unit: "V", verdict: "within", note: "Lamp glowed, then went dark." },
];

beforeAll(async () => {
  pool = new pg.Pool({ connectionString: DATABASE_URL, max: 2 });
  stripe = fakePaymentsClient();

  const account = await stripe.accounts.create({ type: "express", country: "DE", email: REVIEWER.email, capabilities: { transfers: { requested: true } } });
  const onboarded = await fetch(`${PAYMENTS_URL}/api/test/complete-onboarding`, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  if (!onboarded.ok) throw new Error(`onboarding ${account.id} failed with ${onboarded.status}`);
  reviewerAccount = account.id;
  await pool.query(
    `insert into reviewer_profiles (user_id, expertise, profile_md, price_minor, currency, payout_account_id, payouts_enabled, available)
     values ($1, '["welding-inverters","gate-drive","magnetics"]', $2, 4500, 'EUR', $3, true, true)
     on conflict (user_id) do update set price_minor = 4500, payout_account_id = excluded.payout_account_id, payouts_enabled = true, available = true`,
    [REVIEWER.id, "Dozens of half-bridge welders brought up on the co-op's bench. I read **scope captures** and lamp tests closely.", account.id],
  );

  const { rows } = await pool.query("insert into bring_up_logs (owner_id, kit_listing_id, title, notes_md) values ($1, $2, $3, $4) returning id", [
    BUILDER.id,
    DEMO_KIT_ID,
    logTitle,
    "Built from the kit over two weekends. Series lamp: 100 W.",
  ]);
  const logId = rows[0].id as string;
  await pool.query(
    `insert into log_checkpoints (log_id, source_checkpoint_id, position, stage, name, measure, unit, expected_min, expected_max)
     select $1, id, position, stage, name, measure, unit, expected_min, expected_max from listing_checkpoints where listing_id = $2`,
    [logId, DEMO_KIT_ID],
  );
  for (const r of READINGS) {
    await pool.query(
      `insert into readings (log_id, checkpoint_id, value, entered_value, entered_unit, verdict, instrument, note)
       select $1, id, $3, $3, $4, $5, 'Bench scope', $6 from log_checkpoints where log_id = $1 and name = $2`,
      [logId, r.checkpoint, r.value, r.unit, r.verdict, r.note],
    );
  }
});

afterAll(async () => {
  await pool?.end();
});

describe("a paid review in Chromium", () => {
  let builder: Session;
  let reviewer: Session;

  afterAll(async () => {
    await builder?.close();
    await reviewer?.close();
  });

  it("the builder books and pays (held), the reviewer accepts and delivers, the payment is captured and the builder reads the report", async () => {
    builder = await openBrowser();
    const b = builder.page;
    await signInThroughOutbox(b, BUILDER.email, "/reviewers");
    await b.waitForURL(/\/reviewers$/);
    const card = b.locator(`[data-testid="reviewer-card"][data-reviewer="${REVIEWER.id}"]`);
    expect(await card.getByTestId("reviewer-price").textContent()).toBe("€45.00");
    await screenshot(b, "reviews-01-reviewers");
    await card.getByRole("link", { name: `Book a review with ${REVIEWER.name}` }).click();
    await b.waitForURL(/\/reviews\/new\?reviewer=/);

    await b.getByLabel("Bring-up log").selectOption({ label: logTitle });
    await b.getByLabel(/^Low-current load/).uncheck();
    await b.getByLabel(/^Rated load/).uncheck();
    await b.getByLabel("A note to the reviewer (optional)").fill("The duty cycle reads high; is the dead time too short?");
    expect(await b.getByTestId("booking-price").textContent()).toContain("You pay €45.00");
    await screenshot(b, "reviews-02-booking");

    const requestedAt = new Date(Date.now() - 1000);
    await b.getByRole("button", { name: "Pay €45.00 and send the request" }).click();
    await b.waitForURL(/\/pay\/cs_/);
    await b.getByLabel("Card number").fill("4242 4242 4242 4242");
    await screenshot(b, "reviews-03-provider-page");
    await b.getByRole("button", { name: /^Pay / }).click();
    await b.waitForURL(/\/reviews\/[0-9a-f-]{36}\?booked=1$/, { timeout: 30_000 });
    sessionId = /\/reviews\/([0-9a-f-]{36})/.exec(b.url())![1]!;
    await b.getByText("Payment held — request sent").waitFor();
    expect(await b.getByTestId("session-state").textContent()).toBe("Requested");
    expect(await b.getByTestId("payment-status").textContent()).toBe("Held on the card, not charged");
    await screenshot(b, "reviews-04-booked");

    const { rows } = await pool.query("select state, payment_intent_id, price_minor, fee_minor, reviewer_share_minor, stages from review_sessions where id = $1", [sessionId]);
    expect(rows[0]).toMatchObject({ state: "requested", price_minor: 4500, stages: ["control-supply", "series-lamp"] });
    intentId = rows[0].payment_intent_id as string;
    // Only held: a manual-capture intent waits in requires_capture with nothing received.
    expect(await stripe.paymentIntents.retrieve(intentId)).toMatchObject({ status: "requires_capture", amount_capturable: 4500, amount_received: 0 });

    // The reviewer follows the e-mail.
    const request = await waitForMessage(REVIEWER.email, requestedAt, 30_000, "Review request");
    expect(request.subject).toBe(`Review request: “${logTitle}”`);
    const sessionUrl = new URL(firstLink(request, `/reviews/${sessionId}`));
    reviewer = await openBrowser();
    const r = reviewer.page;
    await signInThroughOutbox(r, REVIEWER.email, sessionUrl.pathname);
    await r.waitForURL(new RegExp(`/reviews/${sessionId}$`));
    expect(await r.getByText("The duty cycle reads high; is the dead time too short?").count()).toBe(1);
    // Before accepting, the log is not shared.
    expect(await r.getByTestId("shared-log").count()).toBe(0);
    await screenshot(r, "reviews-05-request");
    await r.getByRole("button", { name: "Accept the request" }).click();
    await r.waitForURL(/\?done=accepted$/);
    expect(await r.getByTestId("session-state").textContent()).toBe("Accepted");
    const shared = r.getByTestId("shared-log");
    await shared.waitFor();
    expect(await shared.locator('[data-testid="reading"][data-verdict="high"]').count()).toBe(1);
    await screenshot(r, "reviews-06-accepted-log");

    await r.getByRole("link", { name: "Write the report" }).click();
    await r.waitForURL(new RegExp(`/reviews/${sessionId}/report$`));
    const checkpoints = r.getByTestId("report-checkpoint");
    expect(await checkpoints.count()).toBe(6);
    for (let i = 0; i < 6; i++) await checkpoints.nth(i).getByRole("radio", { name: /^Fine/ }).check();
    const duty = r.locator('[data-testid="report-checkpoint"][data-checkpoint-name="Gate-drive duty cycle"]');
    await duty.getByRole("radio", { name: /^Needs attention/ }).check();
    await duty.getByLabel("Comment on Gate-drive duty cycle").fill("52 % leaves too little dead time; check the gate-drive transformer's leakage.");
    const ocv = r.locator('[data-testid="report-checkpoint"][data-checkpoint-name="Open-circuit output"]');
    await ocv.getByRole("radio", { name: /^Stop/ }).check();
    await ocv.getByLabel("Comment on Open-circuit output").fill("No reading yet: measure the open-circuit output behind the lamp before any load.");
    await r.getByLabel("Summary").fill("The control side is nearly there. **Fix the dead time first**, then measure the open-circuit output behind the lamp.\n\n<script>alert(1)</script>");
    await screenshot(r, "reviews-07-report-form");
    const deliveredAt = new Date(Date.now() - 1000);
    await r.getByRole("button", { name: "Deliver the report" }).click();
    await r.waitForURL(/\?done=delivered$/, { timeout: 30_000 });
    expect(await r.getByTestId("session-state").textContent()).toBe("Delivered");
    await screenshot(r, "reviews-08-delivered");

    // Captured once on delivery, and the reviewer's share (price less the 8 % fee) sent to their account.
    const captured = await stripe.paymentIntents.retrieve(intentId);
    expect(captured).toMatchObject({ status: "succeeded", amount_received: 4500, amount_capturable: 0 });
    const transfers = (await stripe.transfers.list({ destination: reviewerAccount, limit: 10 })).data;
    expect(transfers.map((t) => t.amount)).toEqual([rows[0].reviewer_share_minor]);
    expect(rows[0].fee_minor + rows[0].reviewer_share_minor).toBe(4500);

    // The builder reads the report.
    const notice = await waitForMessage(BUILDER.email, deliveredAt, 30_000, "Your review report");
    expect(notice.subject).toBe(`Your review report: do not power “${logTitle}” up again yet`);
    await b.goto(`/reviews/${sessionId}`);
    const report = b.getByTestId("review-report");
    await report.waitFor();
    expect(await report.locator('[data-testid="report-verdict"]').count()).toBe(6);
    expect(await report.locator('[data-testid="report-verdict"][data-verdict="stop"]').textContent()).toContain("Open-circuit output");
    expect(await report.getByRole("alert").textContent()).toContain("Do not power up again until this point is fixed");
    expect(await report.locator("strong", { hasText: "Fix the dead time first" }).count()).toBe(1);
    // The script tag in the summary stays text at most, never an element.
    expect(await b.locator("[data-testid='review-report'] script").count()).toBe(0);
    expect(await b.getByTestId("payment-status").textContent()).toBe("Charged");
    expect(await b.getByTestId("dispute-form").count()).toBe(1);
    await screenshot(b, "reviews-09-builder-reads-report");

    await r.goto("/reviews");
    expect(await r.locator(`[data-testid="sessions-reviewer"] [data-testid="session-row"][data-state="delivered"]`).count()).toBeGreaterThan(0);
    expect(await r.getByTestId("reviewer-desk").getAttribute("data-payouts")).toBe("enabled");
    await screenshot(r, "reviews-10-reviewer-desk");
  });

  it("the builder disputes the report and a moderator refunds part of it: refunded on the charge, the reviewer's part reversed", async () => {
    expect(sessionId).not.toBe("");
    const b = builder.page;
    await b.goto(`/reviews/${sessionId}`);
    await b.getByLabel("What is wrong with the report").fill("The stop verdict is for a checkpoint I have not measured yet; I booked a review of my readings.");
    await b.getByRole("button", { name: "Dispute the report" }).click();
    await b.waitForURL(/\?done=disputed$/);
    expect(await b.getByTestId("session-state").textContent()).toBe("Disputed");

    const moderator = await openBrowser();
    try {
      const m = moderator.page;
      await signInThroughOutbox(m, "sefa.moderator@larkspur.test", "/moderate/disputes");
      await m.waitForURL(/\/moderate\/disputes$/);
      const card = m.getByTestId(`dispute-${sessionId}`);
      await card.getByRole("radio", { name: "Refund in part" }).check();
      await card.getByLabel("Amount to refund (EUR)").fill("15.00");
      await card.getByLabel("Your decision, in words").fill("The report is sound on the control side; a third goes back for the unmeasured checkpoint.");
      await screenshot(m, "reviews-11-dispute-desk");
      await card.getByRole("button", { name: "Settle the dispute" }).click();
      await m.waitForURL(/\?done=settled$/);
      await m.getByText("Settled. The session is closed").waitFor();
    } finally {
      await moderator.close();
    }

    const intent = await stripe.paymentIntents.retrieve(intentId);
    expect((await stripe.charges.retrieve(intent.latest_charge as string)).amount_refunded).toBe(1500);
    // The fee gives back its pro-rata part, 1500 × 360 / 4500 = 120; the reviewer's 1380 comes off their transfer.
    const [transfer] = (await stripe.transfers.list({ destination: reviewerAccount, limit: 10 })).data;
    expect(transfer?.amount_reversed).toBe(1380);
    await b.goto(`/reviews/${sessionId}`);
    expect(await b.getByTestId("session-state").textContent()).toBe("Closed");
    expect(await b.getByTestId("payment-status").textContent()).toBe("Charged, €15.00 refunded");
    await screenshot(b, "reviews-12-settled");
  });

  it("a member applies to review, a moderator approves, and the new reviewer connects a payout account and is listed", async () => {
    const email = `e2e.reviewer.${run}@example.test`;
    const applicant = await openBrowser();
    const moderator = await openBrowser();
    try {
      const a = applicant.page;
      await signInThroughOutbox(a, email, "/reviewers/apply");
      await a.waitForURL(/\/reviewers\/apply$/);
      await a.getByLabel("Welding inverters").check();
      await a.getByLabel("Induction heaters").check();
      await a.getByLabel("Profile").fill("I build induction heaters and small welders, and I like reading **lamp tests**. <img src=x onerror=alert(1)>");
      await a.getByLabel("Track record").fill("Four induction heaters from 1 kW to 3 kW and two stick welders brought up through a series lamp, with scope captures of every stage.");
      await a.getByLabel("Price per review (EUR)").fill("39.999");
      await a.getByRole("button", { name: "Send the application" }).click();
      await a.getByText("Use at most 2 digits after the decimal point.").waitFor();
      await a.getByLabel("Price per review (EUR)").fill("39.50");
      await a.getByRole("button", { name: "Send the application" }).click();
      await a.waitForURL(/\/reviewers\/apply\?sent=1$/);
      await a.getByText("Application sent").waitFor();
      expect(await a.getByTestId("reviewer-application-status").getAttribute("data-status")).toBe("pending");
      await screenshot(a, "reviews-13-applied");

      const m = moderator.page;
      await signInThroughOutbox(m, "sefa.moderator@larkspur.test", "/moderate/reviewers");
      await m.waitForURL(/\/moderate\/reviewers$/);
      const card = m.locator('[data-testid^="reviewer-application-"]', { hasText: email });
      expect(await card.locator("img").count()).toBe(0);
      await screenshot(m, "reviews-14-vetting");
      // The receipt of the application went out moments ago; only what comes after the approval counts.
      await new Promise((r) => setTimeout(r, 1100));
      const since = new Date();
      await card.getByRole("button", { name: `Approve ${email}` }).click();
      await m.waitForURL(/\?done=approved$/);
      const welcome = await waitForMessage(email, since, 30_000, "You are a Fluxyard reviewer");
      expect(welcome.subject).toBe("You are a Fluxyard reviewer");

      await a.goto("/reviews");
      await a.getByRole("button", { name: "Connect payout account" }).click();
      await a.waitForURL(/\/onboarding\//);
      await a.getByRole("button", { name: "Finish test onboarding" }).click();
      await a.waitForURL(/\/reviews\?payout=enabled$/);
      expect(await a.getByTestId("reviewer-desk").getAttribute("data-payouts")).toBe("enabled");
      await screenshot(a, "reviews-15-payouts-enabled");
      await a.goto("/reviewers");
      const listed = a.locator('[data-testid="reviewer-card"]', { hasText: "induction heaters and small welders" });
      expect(await listed.getByTestId("reviewer-price").textContent()).toBe("€39.50");
    } finally {
      await applicant.close();
      await moderator.close();
    }
  });
});
