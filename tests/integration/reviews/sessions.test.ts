import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditActions, bookAndPay, BUILDER, createLog, HOUR, MODERATOR, outbox, REVIEWER, reviewerReady, sessionRow, startWorld, STRANGER, verdictsFor, type World } from "./world";

// Jobs are only a nudge after commit (the outbox row is the record); no pg-boss in these tests.
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// The booking state machine of issue 6 against the real PostgreSQL and the payments fake, whose
// objects are read back through the real SDK: a manual-capture intent is `requires_capture` while
// held, `canceled` once released and `succeeded` once captured (the provider's documented intent
// statuses, which the fake's README follows).

let world: World;
let reviewerAccount: string;
const REPORT_SUMMARY = "The control side behaves; bring mains up through the lamp only after the dead time is checked on the scope.";

beforeAll(async () => {
  world = await startWorld("reviews_sessions");
  reviewerAccount = await reviewerReady(world, REVIEWER, 4_500);
});

afterAll(async () => {
  await world?.close();
});

describe("booking", () => {
  it("holds the price with a manual-capture payment, records the session as requested with 48 hours to answer, and e-mails the reviewer", async () => {
    const { logId } = await createLog(world, BUILDER.id);
    const before = Date.now();
    const { sessionId, intentId } = await bookAndPay(world, { logId, stages: ["control-supply", "series-lamp"], message: "First build; the lamp glows dimly at idle." });
    const row = await sessionRow(world, sessionId);
    // 8 % (the seeded platform fee, 800 bp) of €45.00 is €3.60 exactly; the reviewer's share is the rest.
    expect(row).toMatchObject({ state: "requested", builder_id: BUILDER.id, reviewer_id: REVIEWER.id, price_minor: 4_500, fee_bps: 800, fee_minor: 360, reviewer_share_minor: 4_140, currency: "EUR" });
    expect(row.stages).toEqual(["control-supply", "series-lamp"]);
    const respondBy = (row.respond_by as Date).getTime() - (row.created_at as Date).getTime();
    expect(respondBy).toBe(48 * HOUR);
    expect((row.created_at as Date).getTime()).toBeGreaterThanOrEqual(before - 1000);

    const intent = await world.stripe.paymentIntents.retrieve(intentId);
    expect(intent).toMatchObject({ status: "requires_capture", capture_method: "manual", amount: 4_500, amount_capturable: 4_500, amount_received: 0 });
    expect(await auditActions(world, sessionId)).toEqual(["review.booked"]);
    const mails = await outbox(world, "review-requested", REVIEWER.email!);
    expect(mails.at(-1)?.props).toMatchObject({ share: "€41.40", logTitle: expect.stringContaining("Welder bring-up"), message: "First build; the lamp glows dimly at idle." });
  });

  it("records the booking once, whether the builder's return or the provider's event comes first or both", async () => {
    const { handleReviewPaymentEvent } = await import("@/lib/reviews/payments");
    const { logId } = await createLog(world, BUILDER.id);
    const { sessionId, checkoutSessionId } = await bookAndPay(world, { logId, stages: ["control-supply"] });
    const session = await world.stripe.checkout.sessions.retrieve(checkoutSessionId);
    const event = { id: "evt_test_reviews", type: "checkout.session.completed", data: { object: session } } as never;
    expect(await handleReviewPaymentEvent(event)).toEqual({ handled: true, outcome: "booked" });
    expect(await handleReviewPaymentEvent(event)).toEqual({ handled: true, outcome: "booked" });
    const { rows } = await world.pool.query("select id from review_sessions where log_id = $1", [logId]);
    expect(rows.map((r) => r.id)).toEqual([sessionId]);
    expect(await auditActions(world, sessionId)).toEqual(["review.booked"]);
    // An order checkout's event is not ours to handle.
    expect(await handleReviewPaymentEvent({ id: "evt_x", type: "checkout.session.completed", data: { object: { ...session, metadata: { checkoutId: "x" } } } } as never)).toEqual({ handled: false, outcome: "not-ours" });
  });

  it("books the review from a redelivered event when the first delivery was recorded but not booked", async () => {
    const { processEvent } = await import("@/lib/payments/webhooks");
    const { startBooking } = await import("@/lib/reviews/payments");
    const { logId } = await createLog(world, BUILDER.id);
    const { url } = await startBooking(BUILDER, { logId, reviewerId: REVIEWER.id, stages: ["control-supply"] as never, message: "" });
    const checkoutSessionId = url.split("/pay/")[1]!;
    const paid = await fetch(`${world.fake.url}/api/test/pay`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ sessionId: checkoutSessionId, card: "4242 4242 4242 4242" }) });
    expect(paid.ok).toBe(true);
    const session = await world.stripe.checkout.sessions.retrieve(checkoutSessionId);
    const eventId = `evt_redelivered_${checkoutSessionId}`;
    const event = { id: eventId, type: "checkout.session.completed", created: Math.floor(Date.now() / 1000), data: { object: session } } as never;
    // The first delivery's record committed, then booking the review failed (say, a lock timeout); the
    // builder never came back to the return page.
    await world.pool.query("insert into payment_events (id, type, object_id, created_at_provider, payload) values ($1, $2, $3, now(), '{}') on conflict do nothing", [eventId, "checkout.session.completed", checkoutSessionId]);
    const booked = () => world.pool.query("select id from review_sessions where log_id = $1", [logId]).then((r) => r.rows.length);
    const before = await booked();
    const redelivered = await processEvent(event);
    expect(redelivered).toEqual({ status: 200, body: { received: true, duplicate: true } });
    expect(before).toBe(0);
    expect(await booked()).toBe(1);
  });

  it("refuses a second open request of the same log with the same reviewer before any payment", async () => {
    const { quoteBooking } = await import("@/db/queries/reviews");
    const { logId } = await createLog(world, BUILDER.id);
    await bookAndPay(world, { logId, stages: ["control-supply"] });
    await expect(quoteBooking(BUILDER, { logId, reviewerId: REVIEWER.id, stages: ["series-lamp"], message: "" })).rejects.toMatchObject({ status: 409 });
  });

  it("a reviewer cannot book a review of their own log, and the database refuses it too", async () => {
    const { quoteBooking } = await import("@/db/queries/reviews");
    const { logId } = await createLog(world, REVIEWER.id);
    await expect(quoteBooking(REVIEWER, { logId, reviewerId: REVIEWER.id, stages: ["control-supply"], message: "" })).rejects.toMatchObject({ status: 403 });
    // Someone else's log cannot be booked either.
    await expect(quoteBooking(BUILDER, { logId, reviewerId: REVIEWER.id, stages: ["control-supply"], message: "" })).rejects.toMatchObject({ status: 404 });
    await expect(
      world.pool.query(
        `insert into review_sessions (log_id, builder_id, reviewer_id, stages, price_minor, currency, fee_bps, fee_minor, reviewer_share_minor, respond_by)
         values ($1, $2, $2, '["control-supply"]', 4500, 'EUR', 800, 360, 4140, now())`,
        [logId, REVIEWER.id],
      ),
    ).rejects.toMatchObject({ constraint: "review_not_self" });
  });

  it("refuses stages with no checkpoints in the log", async () => {
    const { quoteBooking } = await import("@/db/queries/reviews");
    const { rows } = await world.pool.query("insert into bring_up_logs (owner_id, title) values ($1, 'Own bench supply') returning id", [BUILDER.id]);
    await expect(quoteBooking(BUILDER, { logId: rows[0].id, reviewerId: REVIEWER.id, stages: ["control-supply"], message: "" })).rejects.toMatchObject({ status: 422, fieldErrors: { stages: expect.any(Array) } });
  });
});

describe("answering a request", () => {
  it("only the reviewer accepts; a stranger learns nothing; after 48 hours it can no longer be accepted", async () => {
    const { acceptReview } = await import("@/db/queries/reviews");
    const { logId } = await createLog(world, BUILDER.id);
    const { sessionId } = await bookAndPay(world, { logId, stages: ["control-supply"] });
    await expect(acceptReview({ actor: BUILDER, sessionId })).rejects.toMatchObject({ status: 403 });
    await expect(acceptReview({ actor: STRANGER, sessionId })).rejects.toMatchObject({ status: 404 });
    const created = (await sessionRow(world, sessionId)).created_at as Date;
    await expect(acceptReview({ actor: REVIEWER, sessionId, now: new Date(created.getTime() + 48 * HOUR) })).rejects.toMatchObject({ status: 409 });
    await acceptReview({ actor: REVIEWER, sessionId, now: new Date(created.getTime() + 47 * HOUR) });
    expect((await sessionRow(world, sessionId)).state).toBe("accepted");
    await expect(acceptReview({ actor: REVIEWER, sessionId })).rejects.toMatchObject({ status: 409 });
    expect(await auditActions(world, sessionId)).toEqual(["review.booked", "review.accepted"]);
    expect((await outbox(world, "review-accepted", BUILDER.email!)).length).toBeGreaterThan(0);
  });

  it("declining releases the authorisation: the intent is cancelled in the fake", async () => {
    const { declineReview } = await import("@/db/queries/reviews");
    const { logId } = await createLog(world, BUILDER.id);
    const { sessionId, intentId } = await bookAndPay(world, { logId, stages: ["control-supply"] });
    await expect(declineReview({ actor: BUILDER, sessionId, reason: "" })).rejects.toMatchObject({ status: 403 });
    expect(await declineReview({ actor: REVIEWER, sessionId, reason: "Away at a build week; try another reviewer." })).toEqual({ released: true });
    const row = await sessionRow(world, sessionId);
    expect(row.state).toBe("declined");
    expect(row.released_at).toBeInstanceOf(Date);
    const intent = await world.stripe.paymentIntents.retrieve(intentId);
    expect(intent).toMatchObject({ status: "canceled", amount_capturable: 0, amount_received: 0 });
    expect(await auditActions(world, sessionId)).toEqual(["review.booked", "review.declined", "review.payment_released"]);
    const mail = (await outbox(world, "review-released", BUILDER.email!)).at(-1);
    expect(mail?.props).toMatchObject({ why: "declined", amount: "€45.00", note: "Away at a build week; try another reviewer." });
  });

  it("no answer in 48 hours: the expiry job expires the request and releases the hold; before that it leaves it alone", async () => {
    const { expireOverdueReviews } = await import("@/lib/reviews/sweep");
    const { logId } = await createLog(world, BUILDER.id);
    const { sessionId, intentId } = await bookAndPay(world, { logId, stages: ["series-lamp"] });
    const created = (await sessionRow(world, sessionId)).created_at as Date;
    await expireOverdueReviews(new Date(created.getTime() + 47 * HOUR));
    expect((await sessionRow(world, sessionId)).state).toBe("requested");
    expect((await world.stripe.paymentIntents.retrieve(intentId)).status).toBe("requires_capture");

    const result = await expireOverdueReviews(new Date(created.getTime() + 48 * HOUR + 60_000));
    expect(result.expired).toBeGreaterThanOrEqual(1);
    expect((await sessionRow(world, sessionId)).state).toBe("expired");
    expect((await world.stripe.paymentIntents.retrieve(intentId)).status).toBe("canceled");
    expect(await auditActions(world, sessionId)).toEqual(["review.booked", "review.expired", "review.payment_released"]);
    // A second run finds nothing more to do for it.
    await expireOverdueReviews(new Date(created.getTime() + 50 * HOUR));
    expect(await auditActions(world, sessionId)).toEqual(["review.booked", "review.expired", "review.payment_released"]);
  });

  it("a release the provider did not answer is retried by the job, once", async () => {
    const { declineReview } = await import("@/db/queries/reviews");
    const { expireOverdueReviews } = await import("@/lib/reviews/sweep");
    const { logId } = await createLog(world, BUILDER.id);
    const { sessionId, intentId } = await bookAndPay(world, { logId, stages: ["control-supply"] });
    await world.paymentsDown(true);
    try {
      expect(await declineReview({ actor: REVIEWER, sessionId, reason: "" })).toEqual({ released: false });
    } finally {
      await world.paymentsDown(false);
    }
    expect((await sessionRow(world, sessionId)).released_at).toBeNull();
    expect((await world.stripe.paymentIntents.retrieve(intentId)).status).toBe("requires_capture");
    await expireOverdueReviews(new Date());
    expect((await world.stripe.paymentIntents.retrieve(intentId)).status).toBe("canceled");
    expect((await sessionRow(world, sessionId)).released_at).toBeInstanceOf(Date);
  });
});

describe("delivering the report", () => {
  async function acceptedSession(stages: string[]) {
    const { acceptReview } = await import("@/db/queries/reviews");
    const log = await createLog(world, BUILDER.id);
    const booking = await bookAndPay(world, { logId: log.logId, stages });
    await acceptReview({ actor: REVIEWER, sessionId: booking.sessionId });
    return { ...booking, ...log };
  }

  it("a builder cannot deliver a report; nothing is captured", async () => {
    const { deliverReport } = await import("@/db/queries/reviews");
    const s = await acceptedSession(["control-supply"]);
    await expect(deliverReport({ actor: BUILDER, sessionId: s.sessionId, report: { verdicts: verdictsFor(s.checkpoints, ["control-supply"]), summaryMd: REPORT_SUMMARY } })).rejects.toMatchObject({ status: 403 });
    await expect(deliverReport({ actor: { ...BUILDER, roles: ["member", "reviewer"] }, sessionId: s.sessionId, report: { verdicts: verdictsFor(s.checkpoints, ["control-supply"]), summaryMd: REPORT_SUMMARY } })).rejects.toMatchObject({ status: 403 });
    expect((await sessionRow(world, s.sessionId)).state).toBe("accepted");
    expect((await world.stripe.paymentIntents.retrieve(s.intentId)).status).toBe("requires_capture");
  });

  it("needs a verdict for exactly the checkpoints in scope", async () => {
    const { deliverReport } = await import("@/db/queries/reviews");
    const s = await acceptedSession(["control-supply"]);
    const inScope = verdictsFor(s.checkpoints, ["control-supply"]);
    const missing = inScope.slice(1);
    await expect(deliverReport({ actor: REVIEWER, sessionId: s.sessionId, report: { verdicts: missing, summaryMd: REPORT_SUMMARY } })).rejects.toMatchObject({ status: 422 });
    const outside = [...inScope, ...verdictsFor(s.checkpoints, ["rated-load"])];
    await expect(deliverReport({ actor: REVIEWER, sessionId: s.sessionId, report: { verdicts: outside, summaryMd: REPORT_SUMMARY } })).rejects.toMatchObject({ status: 422 });
    expect((await sessionRow(world, s.sessionId)).state).toBe("accepted");
  });

  it("two deliveries at once: one wins, the payment is captured once and the reviewer's share transferred once", async () => {
    const { deliverReport, collectReviewPayment } = await import("@/db/queries/reviews");
    const s = await acceptedSession(["control-supply", "series-lamp"]);
    const report = { verdicts: verdictsFor(s.checkpoints, ["control-supply", "series-lamp"]), summaryMd: REPORT_SUMMARY };
    const results = await Promise.allSettled([
      deliverReport({ actor: REVIEWER, sessionId: s.sessionId, report }),
      deliverReport({ actor: REVIEWER, sessionId: s.sessionId, report }),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const refused = results.find((r) => r.status === "rejected") as PromiseRejectedResult;
    expect(refused.reason).toMatchObject({ status: 409 });

    const intent = await world.stripe.paymentIntents.retrieve(s.intentId);
    expect(intent).toMatchObject({ status: "succeeded", amount_received: 4_500, amount_capturable: 0 });
    const chargeId = intent.latest_charge as string;
    // The sweep (or a retry) asking again changes nothing at the provider.
    await collectReviewPayment(s.sessionId);
    const captures = (await world.stripe.events.list({ type: "charge.captured", limit: 100 })).data.filter((e) => (e.data.object as { id: string }).id === chargeId);
    expect(captures).toHaveLength(1);
    const transfers = (await world.stripe.transfers.list({ destination: reviewerAccount, limit: 100 })).data.filter((t) => t.source_transaction === chargeId);
    expect(transfers.map((t) => t.amount)).toEqual([4_140]);

    const row = await sessionRow(world, s.sessionId);
    expect(row).toMatchObject({ state: "delivered", transfer_id: transfers[0]!.id });
    expect(row.captured_at).toBeInstanceOf(Date);
    expect((row.dispute_by as Date).getTime() - (row.delivered_at as Date).getTime()).toBe(7 * 24 * HOUR);
    expect(await auditActions(world, s.sessionId)).toEqual(["review.booked", "review.accepted", "review.delivered", "review.payment_captured", "review.share_transferred"]);
    const { rows: verdicts } = await world.pool.query("select verdict, comment from review_verdicts where session_id = $1", [s.sessionId]);
    expect(verdicts).toHaveLength(6);
    expect((await outbox(world, "review-delivered", BUILDER.email!)).at(-1)?.props).toMatchObject({ fine: 5, attention: 1, stops: 0, amount: "€45.00" });
  });

  it("a capture the provider did not answer is retried by the job, and still happens once", async () => {
    const { deliverReport } = await import("@/db/queries/reviews");
    const { expireOverdueReviews } = await import("@/lib/reviews/sweep");
    const s = await acceptedSession(["low-current"]);
    await world.paymentsDown(true);
    try {
      expect(await deliverReport({ actor: REVIEWER, sessionId: s.sessionId, report: { verdicts: verdictsFor(s.checkpoints, ["low-current"]), summaryMd: REPORT_SUMMARY } })).toEqual({ captured: false, transferred: false });
    } finally {
      await world.paymentsDown(false);
    }
    expect((await sessionRow(world, s.sessionId)).state).toBe("delivered");
    expect((await world.stripe.paymentIntents.retrieve(s.intentId)).status).toBe("requires_capture");
    await expireOverdueReviews(new Date());
    await expireOverdueReviews(new Date());
    const intent = await world.stripe.paymentIntents.retrieve(s.intentId);
    expect(intent.status).toBe("succeeded");
    const captures = (await world.stripe.events.list({ type: "charge.captured", limit: 100 })).data.filter((e) => (e.data.object as { id: string }).id === intent.latest_charge);
    expect(captures).toHaveLength(1);
    expect((await sessionRow(world, s.sessionId)).transfer_id).toMatch(/^tr_/);
  });

  it("an accepted session with no report by the delivery deadline expires and releases the hold", async () => {
    const { deliverReport } = await import("@/db/queries/reviews");
    const { expireOverdueReviews } = await import("@/lib/reviews/sweep");
    const s = await acceptedSession(["control-supply"]);
    const created = (await sessionRow(world, s.sessionId)).created_at as Date;
    const late = new Date(created.getTime() + 6 * 24 * HOUR);
    await expect(deliverReport({ actor: REVIEWER, sessionId: s.sessionId, now: late, report: { verdicts: verdictsFor(s.checkpoints, ["control-supply"]), summaryMd: REPORT_SUMMARY } })).rejects.toMatchObject({ status: 409 });
    await expireOverdueReviews(late);
    expect((await sessionRow(world, s.sessionId)).state).toBe("expired");
    expect((await world.stripe.paymentIntents.retrieve(s.intentId)).status).toBe("canceled");
  });
});

describe("disputes", () => {
  async function deliveredSession() {
    const { acceptReview, deliverReport } = await import("@/db/queries/reviews");
    const log = await createLog(world, BUILDER.id);
    const booking = await bookAndPay(world, { logId: log.logId, stages: ["control-supply"] });
    await acceptReview({ actor: REVIEWER, sessionId: booking.sessionId });
    await deliverReport({ actor: REVIEWER, sessionId: booking.sessionId, report: { verdicts: verdictsFor(log.checkpoints, ["control-supply"]), summaryMd: REPORT_SUMMARY } });
    const row = await sessionRow(world, booking.sessionId);
    const intent = await world.stripe.paymentIntents.retrieve(booking.intentId);
    return { ...booking, chargeId: intent.latest_charge as string, transferId: row.transfer_id as string, deliveredAt: row.delivered_at as Date };
  }

  const reason = "The report names the wrong checkpoints and says nothing about the lamp.";

  it("only the builder disputes, within 7 days; the reviewer hears of it", async () => {
    const { disputeReview } = await import("@/db/queries/reviews");
    const s = await deliveredSession();
    await expect(disputeReview({ actor: REVIEWER, sessionId: s.sessionId, reason })).rejects.toMatchObject({ status: 403 });
    await expect(disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason, now: new Date(s.deliveredAt.getTime() + 7 * 24 * HOUR) })).rejects.toMatchObject({ status: 409 });
    await disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason });
    expect((await sessionRow(world, s.sessionId)).state).toBe("disputed");
    expect((await outbox(world, "review-disputed", REVIEWER.email!)).at(-1)?.props).toMatchObject({ reason });
  });

  it("refund in full: the whole price back on the charge, the reviewer's whole share reversed, closed", async () => {
    const { disputeReview, settleDispute } = await import("@/db/queries/reviews");
    const s = await deliveredSession();
    await disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason });
    await expect(settleDispute({ actor: REVIEWER, sessionId: s.sessionId, decision: { outcome: "refund_full", note: "Refund in full after reading the log." } })).rejects.toMatchObject({ status: 403 });
    await settleDispute({ actor: MODERATOR, sessionId: s.sessionId, decision: { outcome: "refund_full", note: "The report covers none of the booked checkpoints; refunded in full." } });
    expect((await world.stripe.charges.retrieve(s.chargeId)).amount_refunded).toBe(4_500);
    expect((await world.stripe.transfers.retrieve(s.transferId)).amount_reversed).toBe(4_140);
    expect(await sessionRow(world, s.sessionId)).toMatchObject({ state: "closed", refunded_minor: 4_500 });
    const { rows } = await world.pool.query("select outcome, refund_minor, decided_by from review_disputes where session_id = $1", [s.sessionId]);
    expect(rows).toEqual([{ outcome: "refunded_full", refund_minor: 4_500, decided_by: MODERATOR.id }]);
    expect((await auditActions(world, s.sessionId)).at(-1)).toBe("review.dispute_settled");
    // Settling again finds nothing open; no second refund.
    await expect(settleDispute({ actor: MODERATOR, sessionId: s.sessionId, decision: { outcome: "refund_full", note: "Again, by mistake, twice." } })).rejects.toMatchObject({ status: 409 });
    expect((await world.stripe.refunds.list({ payment_intent: s.intentId })).data).toHaveLength(1);
  });

  it("refund in part: the amount back on the charge, the fee's part given up pro rata, the reviewer's part reversed", async () => {
    const { disputeReview, settleDispute } = await import("@/db/queries/reviews");
    const s = await deliveredSession();
    await disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason });
    await expect(settleDispute({ actor: MODERATOR, sessionId: s.sessionId, decision: { outcome: "refund_partial", refundMinor: 4_500, note: "All of it as a part refund." } })).rejects.toMatchObject({ status: 422 });
    await settleDispute({ actor: MODERATOR, sessionId: s.sessionId, decision: { outcome: "refund_partial", refundMinor: 1_500, note: "Half the stages were covered well; a third goes back." } });
    expect((await world.stripe.charges.retrieve(s.chargeId)).amount_refunded).toBe(1_500);
    // Fee back: 1500 × 360 / 4500 = 120 exactly; the reviewer's part 1380 comes off their transfer.
    expect((await world.stripe.transfers.retrieve(s.transferId)).amount_reversed).toBe(1_380);
    expect(await sessionRow(world, s.sessionId)).toMatchObject({ state: "closed", refunded_minor: 1_500 });
    const { rows } = await world.pool.query("select details from audit_log where action = 'review.dispute_settled' and subject_id = $1", [s.sessionId]);
    expect(rows[0].details).toMatchObject({ outcome: "refund_partial", refundMinor: 1_500, feeRefundMinor: 120, reviewerRefundMinor: 1_380 });
    expect((await outbox(world, "review-dispute-settled", BUILDER.email!)).at(-1)?.props).toMatchObject({ refund: "€15.00", role: "builder" });
  });

  it("the payment stands: nothing refunded, closed; a moderator who booked it may not settle it", async () => {
    const { disputeReview, settleDispute } = await import("@/db/queries/reviews");
    const s = await deliveredSession();
    await disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason });
    await expect(settleDispute({ actor: { ...BUILDER, roles: ["member", "moderator"] }, sessionId: s.sessionId, decision: { outcome: "payment_stands", note: "My own dispute, closing it." } })).rejects.toMatchObject({ status: 403 });
    await settleDispute({ actor: MODERATOR, sessionId: s.sessionId, decision: { outcome: "payment_stands", note: "The report covers every booked checkpoint with reasons." } });
    expect((await world.stripe.charges.retrieve(s.chargeId)).amount_refunded).toBe(0);
    expect((await world.stripe.transfers.retrieve(s.transferId)).amount_reversed).toBe(0);
    expect(await sessionRow(world, s.sessionId)).toMatchObject({ state: "closed", refunded_minor: 0 });
  });

  it("with no dispute after 7 days the job closes the session and the payment stands", async () => {
    const { disputeReview } = await import("@/db/queries/reviews");
    const { expireOverdueReviews } = await import("@/lib/reviews/sweep");
    const s = await deliveredSession();
    await expireOverdueReviews(new Date(s.deliveredAt.getTime() + 7 * 24 * HOUR - 60_000));
    expect((await sessionRow(world, s.sessionId)).state).toBe("delivered");
    await expireOverdueReviews(new Date(s.deliveredAt.getTime() + 7 * 24 * HOUR));
    expect((await sessionRow(world, s.sessionId)).state).toBe("closed");
    await expect(disputeReview({ actor: BUILDER, sessionId: s.sessionId, reason })).rejects.toMatchObject({ status: 409 });
    expect((await world.stripe.charges.retrieve(s.chargeId)).amount_refunded).toBe(0);
  });
});
