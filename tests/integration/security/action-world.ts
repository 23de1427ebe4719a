// The world the server actions of the access matrix run in: a seeded database, the payments
// stand-in on a free port, and makers of fresh rows for each call, so every person meets the thing
// in the state the action needs (and one person's success cannot change what the next one meets).
// The payment-backed rows (paid orders, booked reviews) come from the orders and reviews tests' own
// helpers, which go through the real payment paths.
import { randomBytes, randomUUID } from "node:crypto";
import pg from "pg";
import Stripe from "stripe";
import { seedDemo } from "@/db/seed";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import type { SessionUser } from "@/lib/auth/access";
import { copyListing, templateKit } from "../../support/access-fixtures";
import { PERSONA_USER_IDS } from "../../support/access-matrix";
import { freshDatabase } from "../../support/test-database";
import { createPaidOrder, sellerAccount } from "../orders/world";
import { bookAndPay, createLog, reviewerReady, verdictsFor } from "../reviews/world";

const SECRET_KEY = "sk_test_access_matrix_actions";

export type ActionWorld = {
  pool: pg.Pool;
  stripe: Stripe;
  fake: PaymentsFake;
  kit: { id: string; title: string };
  paymentsDown(down: boolean): Promise<void>;
  close(): Promise<void>;
};

export async function startActionWorld(): Promise<ActionWorld> {
  const database = await freshDatabase("security_actions");
  await seedDemo(database.url);
  const fake = await startPaymentsFake({ port: 0, log: () => {} });
  process.env.DATABASE_URL = database.url;
  process.env.STRIPE_API_URL = fake.url;
  process.env.STRIPE_SECRET_KEY = SECRET_KEY;
  process.env.APP_URL = "http://localhost:3999";
  (await import("@/lib/env"))._resetEnvForTests();
  (await import("@/lib/payments/client"))._resetPaymentsClientForTests();
  const { hostname, port } = new URL(fake.url);
  const stripe = new Stripe(SECRET_KEY, { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
  const pool = new pg.Pool({ connectionString: database.url, max: 4 });
  pool.on("error", () => {});
  const world: ActionWorld = {
    pool,
    stripe,
    fake,
    kit: templateKit(),
    paymentsDown: async (down) => {
      await fetch(`${fake.url}/api/test/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down }) });
    },
    close: async () => {
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await fake.close();
      await database.drop();
    },
  };
  // Payouts ready, as the launcher makes them for the demo: both sellers can be paid, the reviewer too.
  await sellerAccount(world, PERSONA_USER_IDS.sellerOwner, 30);
  await sellerAccount(world, PERSONA_USER_IDS.sellerOther, 14);
  await reviewerReady(world, await sessionUser(PERSONA_USER_IDS.reviewer), 4_500);
  return world;
}

export async function sessionUser(id: string): Promise<SessionUser> {
  const { getUserWithRoles } = await import("@/db/queries/users");
  const user = await getUserWithRoles(id);
  if (!user) throw new Error(`no user ${id}`);
  return user;
}

const tag = () => randomBytes(3).toString("hex");

/** Someone new who has just signed up (a member and nothing else). */
export async function newcomer(w: ActionWorld): Promise<string> {
  const id = `access-newcomer-${tag()}`;
  await w.pool.query("insert into users (id, name, email) values ($1, 'Invented Newcomer', $2)", [id, `${id}@larkspur.test`]);
  await w.pool.query("insert into user_roles (user_id, role) values ($1, 'member')", [id]);
  return id;
}

export async function listing(w: ActionWorld, state: "draft" | "in_review" | "live" | "held"): Promise<string> {
  const overrides = state === "live" || state === "held" ? { stock: 5 } : { live_at: null, stock: 5 };
  return (await copyListing(w.pool, w.kit.id, state, tag(), overrides)).id;
}

/** member's paid order from sellerOwner (a real paid intent and transfer in the stand-in). */
export async function paidOrder(w: ActionWorld) {
  return createPaidOrder(w, { lines: [{ title: "Gate drive board", unitPriceMinor: 4_000, quantity: 1, stockLeft: 2 }], feeMinor: 320 });
}

export async function shippedOrder(w: ActionWorld) {
  const order = await paidOrder(w);
  const { shipOrder } = await import("@/db/queries/orders");
  await shipOrder({ orderId: order.orderId, actorId: PERSONA_USER_IDS.sellerOwner, carrier: "Yard Post", trackingRef: `YP-${tag()}` });
  return order;
}

export async function deliveredOrder(w: ActionWorld) {
  const order = await shippedOrder(w);
  const { markDelivered } = await import("@/db/queries/orders");
  await markDelivered({ orderId: order.orderId, actorId: PERSONA_USER_IDS.member });
  return order;
}

export async function orderWithOpenReturn(w: ActionWorld) {
  const order = await deliveredOrder(w);
  const { requestReturn } = await import("@/db/queries/orders");
  const { returnId } = await requestReturn({ orderId: order.orderId, actorId: PERSONA_USER_IDS.member, reason: "The board arrived with a lifted pad." });
  return { ...order, returnId };
}

/** member's log of the demo kit, with its checkpoints. */
export async function memberLog(w: ActionWorld) {
  return createLog(w, PERSONA_USER_IDS.member);
}

/** member's review booked and paid with reviewer, in the state asked for. */
export async function reviewSession(w: ActionWorld, state: "requested" | "accepted" | "delivered" | "disputed") {
  const log = await memberLog(w);
  const stages = ["series-lamp"];
  const { sessionId } = await bookAndPay(w, { logId: log.logId, stages });
  const { acceptReview, deliverReport, disputeReview } = await import("@/db/queries/reviews");
  const reviewer = await sessionUser(PERSONA_USER_IDS.reviewer);
  if (state !== "requested") await acceptReview({ actor: reviewer, sessionId });
  if (state === "delivered" || state === "disputed") {
    await deliverReport({
      actor: reviewer,
      sessionId,
      report: { verdicts: verdictsFor(log.checkpoints, stages), summaryMd: "The series-lamp stage reads as it should; the bus settles where the kit says it will." },
    });
  }
  if (state === "disputed") {
    await disputeReview({ actor: await sessionUser(PERSONA_USER_IDS.member), sessionId, reason: "The report skips the idle current I asked about." });
  }
  return { sessionId, checkpoints: log.checkpoints.filter((c) => stages.includes(c.stage)) };
}

export async function question(w: ActionWorld, state: "pending" | "visible" | "hidden" | "removed", authorId: string = PERSONA_USER_IDS.member): Promise<string> {
  const { rows } = await w.pool.query(
    "insert into questions (author_id, title, body_md, state, removal_reason) values ($1, $2, $3, $4, $5) returning id",
    [authorId, `Series lamp stays bright ${tag()}`, "With the 100 W lamp in series the lamp stays bright after the bus charges. What should I check first?", state, state === "removed" ? "Off topic." : null],
  );
  return rows[0].id as string;
}

export async function answer(w: ActionWorld, questionId: string, authorId: string): Promise<string> {
  const { rows } = await w.pool.query("insert into answers (question_id, author_id, body_md, state) values ($1, $2, $3, 'visible') returning id", [
    questionId,
    authorId,
    "Check the bridge rectifier first: a shorted diode keeps the lamp lit.",
  ]);
  return rows[0].id as string;
}

export async function sellerApplication(w: ActionWorld): Promise<string> {
  const { createApplication } = await import("@/db/queries/sellers");
  const applicant = await newcomer(w);
  const app = await createApplication(applicant, {
    shopName: `Invented Coil Shop ${tag()}`,
    profileMd: "Hand-wound chokes for bench supplies, measured before they ship.",
    country: "NL",
    returnsPolicyMd: "Unused parts within 14 days, in their bags.",
    returnsWindowDays: 14,
  });
  return app.id;
}

export async function reviewerApplication(w: ActionWorld): Promise<string> {
  const { createReviewerApplication } = await import("@/db/queries/reviews");
  const applicant = await newcomer(w);
  const app = await createReviewerApplication(applicant, {
    expertise: ["bench-supplies"],
    profileMd: "I bring up linear and switching bench supplies at the yard, slowly and with a lamp.",
    trackRecordMd: "Brought up six bench supplies and two chargers; measured ripple, idle current and the bleeder discharge time on each before anyone used them.",
    priceMinor: 3_000,
  });
  return app.id;
}

export { randomUUID };
