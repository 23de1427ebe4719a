// A database with the demo accounts, the payments fake on a free port and the app's modules pointed
// at both. Logs are written straight into bring_up_logs / log_checkpoints / readings (copied from the
// demo welder kit's checkpoints), and bookings go through the real path: the hosted payment session
// is opened by the app, paid through the fake's test hook as the hosted page would, and recorded.
import { randomBytes } from "node:crypto";
import pg from "pg";
import Stripe from "stripe";
import { seedDemo } from "@/db/seed";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import type { SessionUser } from "@/lib/auth/access";
import { freshDatabase } from "../../support/test-database";

export const DEMO_KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
export const BUILDER: SessionUser = { id: "demo-builder", email: "noor.builds@larkspur.test", name: "Noor Delacroix-Haidari", roles: ["member"] };
export const REVIEWER: SessionUser = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test", name: "Tamsin Achterberg", roles: ["member", "reviewer"] };
export const MODERATOR: SessionUser = { id: "demo-moderator", email: "sefa.moderator@larkspur.test", name: null, roles: ["member", "moderator"] };
export const STRANGER: SessionUser = { id: "demo-seller-kits", email: "bram.kits@larkspur.test", name: null, roles: ["member", "seller"] };
const SECRET_KEY = "sk_test_reviews_integration";

export type World = {
  pool: pg.Pool;
  stripe: Stripe;
  fake: PaymentsFake;
  paymentsDown(down: boolean): Promise<void>;
  close(): Promise<void>;
};

export async function startWorld(label: string): Promise<World> {
  const database = await freshDatabase(label);
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
  return {
    pool,
    stripe,
    fake,
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
}

/** A connected account that finished onboarding in the fake, on the person's reviewer profile (made if missing). */
export async function reviewerReady(world: World, user: SessionUser, priceMinor = 4_500): Promise<string> {
  const account = await world.stripe.accounts.create({ type: "express", country: "DE", email: user.email ?? undefined, capabilities: { transfers: { requested: true } } });
  await fetch(`${world.fake.url}/api/test/complete-onboarding`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  await world.pool.query("insert into user_roles (user_id, role) values ($1, 'reviewer') on conflict do nothing", [user.id]);
  await world.pool.query(
    `insert into reviewer_profiles (user_id, expertise, profile_md, price_minor, currency, payout_account_id, payouts_enabled)
     values ($1, '["welding-inverters","gate-drive"]', 'Invented reviewer for the tests.', $2, 'EUR', $3, true)
     on conflict (user_id) do update set price_minor = excluded.price_minor, payout_account_id = excluded.payout_account_id, payouts_enabled = true, available = true`,
    [user.id, priceMinor, account.id],
  );
  return account.id;
}

/** A log of the demo welder kit's nine checkpoints (four stages), with one reading on the first. */
export async function createLog(world: World, ownerId: string): Promise<{ logId: string; checkpoints: { id: string; stage: string }[] }> {
  const title = `Welder bring-up ${randomBytes(3).toString("hex")}`;
  const { rows } = await world.pool.query("insert into bring_up_logs (owner_id, kit_listing_id, title) values ($1, $2, $3) returning id", [ownerId, DEMO_KIT_ID, title]);
  const logId = rows[0].id as string;
  const copied = await world.pool.query(
    `insert into log_checkpoints (log_id, source_checkpoint_id, position, stage, name, measure, unit, expected_min, expected_max)
     select $1, id, position, stage, name, measure, unit, expected_min, expected_max from listing_checkpoints where listing_id = $2
     returning id, stage::text as stage, position`,
    [logId, DEMO_KIT_ID],
  );
  const checkpoints = (copied.rows as { id: string; stage: string; position: number }[]).sort((a, b) => a.position - b.position);
  await world.pool.query(
    "insert into readings (log_id, checkpoint_id, value, entered_value, entered_unit, verdict, instrument) values ($1, $2, 40.1, 40.1, 'kHz', 'within', 'Bench scope')",
    [logId, checkpoints[0]!.id],
  );
  return { logId, checkpoints };
}

/** The builder's booking, paid with a test card on the fake as its hosted page would, then recorded on return. */
export async function bookAndPay(world: World, input: { builder?: SessionUser; reviewerId?: string; logId: string; stages: string[]; message?: string }) {
  const { startBooking, completeBookingFromReturn } = await import("@/lib/reviews/payments");
  const builder = input.builder ?? BUILDER;
  const { url } = await startBooking(builder, {
    logId: input.logId,
    reviewerId: input.reviewerId ?? REVIEWER.id,
    stages: input.stages as never,
    message: input.message ?? "",
  });
  const checkoutSessionId = url.split("/pay/")[1]!;
  const paid = await fetch(`${world.fake.url}/api/test/pay`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ sessionId: checkoutSessionId, card: "4242 4242 4242 4242" }),
  });
  if (!paid.ok) throw new Error(`paying ${checkoutSessionId} failed with ${paid.status}`);
  const completion = await completeBookingFromReturn(checkoutSessionId, builder.id);
  if (completion.kind !== "booked") throw new Error(`booking not recorded: ${JSON.stringify(completion)}`);
  const session = await sessionRow(world, completion.sessionId);
  return { sessionId: completion.sessionId, checkoutSessionId, intentId: session.payment_intent_id as string };
}

export async function sessionRow(world: World, id: string) {
  const { rows } = await world.pool.query("select * from review_sessions where id = $1", [id]);
  return rows[0] as Record<string, unknown> & { state: string; payment_intent_id: string | null };
}

export async function auditActions(world: World, subjectId: string): Promise<string[]> {
  const { rows } = await world.pool.query("select action from audit_log where subject_id = $1 order by id", [subjectId]);
  return rows.map((r) => r.action as string);
}

export async function outbox(world: World, template: string, to?: string): Promise<{ to: string; props: Record<string, unknown> }[]> {
  const { rows } = await world.pool.query('select "to", props from mail_outbox where template = $1 order by created_at', [template]);
  return to ? rows.filter((r) => r.to === to) : rows;
}

/** Verdicts for every checkpoint of the stages, the first one "needs attention". */
export function verdictsFor(checkpoints: { id: string; stage: string }[], stages: string[]) {
  return checkpoints
    .filter((c) => stages.includes(c.stage))
    .map((c, i) => ({ checkpointId: c.id, verdict: (i === 0 ? "needs_attention" : "fine") as "fine" | "needs_attention", comment: i === 0 ? "Duty cycle sits at the top of its range; check the dead time." : "" }));
}

export const HOUR = 3_600_000;
