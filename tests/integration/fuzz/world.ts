// The database the fuzzed routes run against: the demo accounts, plus one row in every state a
// route needs to get past its lookups to its input parsing (a listing in review, a live and a held
// listing, a pending seller application, a visible question with an answer, a paid and a delivered
// order with an open return). Rows are written with plain SQL so the fuzz does not depend on the
// code it is probing. `tableDigest()` is the "nothing was written" check: one digest over every row
// of every table in the app's schema.
import pg from "pg";
import { seedDemo } from "@/db/seed";
import { freshDatabase } from "../../support/test-database";

export const BUYER = "demo-builder";
export const SELLER = "demo-seller-kits";
export const MODERATOR = "demo-moderator";
export const ADMIN = "demo-admin";
export const OTHER_MEMBER = "demo-reviewer";

export type Fixtures = {
  inReviewListing: string;
  liveListing: string;
  heldListing: string;
  sellersListing: string;
  pendingApplication: string;
  question: string;
  answer: string;
  paidOrder: string;
  paidOrderLine: string;
  deliveredOrder: string;
  openReturn: string;
};

export type FuzzWorld = { pool: pg.Pool; ids: Fixtures; close(): Promise<void> };

async function one<T>(pool: pg.Pool, sql: string, params: unknown[] = []): Promise<T> {
  const { rows } = await pool.query(sql, params);
  if (!rows[0]) throw new Error(`fixture query returned nothing: ${sql}`);
  return Object.values(rows[0])[0] as T;
}

/** A copy of one of the seller's seeded listings, in the given state, under a fresh slug. */
async function listingIn(pool: pg.Pool, state: string, sellerId = SELLER): Promise<string> {
  return one<string>(
    pool,
    `insert into listings (seller_id, kind, magnetic_subtype, title, slug, description_md, price_minor, currency, stock,
       figures, declaration, safety_notes, state, submitted_at, live_at, policy_revision, policy_status)
     select seller_id, kind, magnetic_subtype, 'Fuzz fixture ' || $1, 'fuzz-' || $1 || '-' || substr(md5(random()::text), 1, 8),
       description_md, price_minor, currency, 5, figures, declaration, safety_notes, $1::listing_state, now(),
       case when $1 in ('live', 'held') then now() end, policy_revision, policy_status
     from listings where seller_id = $2 order by slug limit 1
     returning id`,
    [state, sellerId],
  );
}

async function order(pool: pg.Pool, listingId: string, state: "paid" | "delivered"): Promise<{ orderId: string; lineId: string }> {
  const checkout = await one<string>(
    pool,
    `insert into checkouts (buyer_id, email, currency, total_minor, fee_bps, status, expires_at, paid_at)
     values ($1, 'noor.builds@larkspur.test', 'EUR', 12000, 800, 'paid', now() + interval '1 hour', now()) returning id`,
    [BUYER],
  );
  const orderId = await one<string>(
    pool,
    `insert into orders (number, checkout_id, buyer_id, seller_id, state, currency, subtotal_minor, fee_minor, seller_share_minor,
       paid_at, shipped_at, delivered_at, carrier, tracking_ref)
     values ('FZ-' || substr(md5(random()::text), 1, 8), $1, $2, $3, $4::order_state, 'EUR', 12000, 960, 11040, now(),
       case when $4 = 'delivered' then now() end, case when $4 = 'delivered' then now() end,
       case when $4 = 'delivered' then 'Yard Post' end, case when $4 = 'delivered' then 'YP-0001' end)
     returning id`,
    [checkout, BUYER, SELLER, state],
  );
  const lineId = await one<string>(
    pool,
    `insert into order_lines (order_id, listing_id, title, unit_price_minor, quantity, sheet_revision)
     values ($1, $2, 'Fuzz fixture kit', 12000, 1, 1) returning id`,
    [orderId, listingId],
  );
  return { orderId, lineId };
}

export async function startFuzzWorld(label: string): Promise<FuzzWorld> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  const pool = new pg.Pool({ connectionString: database.url, max: 3 });
  pool.on("error", () => {});

  // The app's modules read these on first use; nothing here may reach a real service.
  process.env.DATABASE_URL = database.url;
  process.env.STRIPE_API_URL = "http://127.0.0.1:9";
  process.env.RESEND_BASE_URL = "http://127.0.0.1:9";
  const { _resetEnvForTests } = await import("@/lib/env");
  _resetEnvForTests();

  const liveListing = await listingIn(pool, "live");
  const paid = await order(pool, liveListing, "paid");
  const delivered = await order(pool, liveListing, "delivered");
  await pool.query("insert into users (id, name, email) values ('fuzz-applicant', 'Fuzz Applicant', 'fuzz.applicant@larkspur.test')");
  await pool.query("insert into user_roles (user_id, role) values ('fuzz-applicant', 'member')");
  const ids: Fixtures = {
    inReviewListing: await listingIn(pool, "in_review"),
    liveListing,
    heldListing: await listingIn(pool, "held"),
    sellersListing: await listingIn(pool, "draft"),
    pendingApplication: await one<string>(
      pool,
      `insert into seller_applications (user_id, shop_name, profile_md, country, returns_policy_md)
       values ('fuzz-applicant', 'Fuzz Fixture Windings', 'An invented shop for the fuzz tests.', 'DE', 'Returns within 30 days.') returning id`,
    ),
    question: await one<string>(
      pool,
      `insert into questions (author_id, title, body_md, state) values ($1, 'Fuzz fixture question about the bus', 'A question body that is long enough to be valid.', 'visible') returning id`,
      [BUYER],
    ),
    answer: "",
    paidOrder: paid.orderId,
    paidOrderLine: paid.lineId,
    deliveredOrder: delivered.orderId,
    openReturn: await one<string>(pool, "insert into return_requests (order_id, reason) values ($1, 'The fixture asks to return it.') returning id", [delivered.orderId]),
  };
  ids.answer = await one<string>(
    pool,
    "insert into answers (question_id, author_id, body_md, state) values ($1, $2, 'An answer body that is long enough to be valid.', 'visible') returning id",
    [ids.question, OTHER_MEMBER],
  );

  return {
    pool,
    ids,
    close: async () => {
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await database.drop();
    },
  };
}

/**
 * One digest over every row of every table in the public schema (the append-only audit log
 * included), so any insert, update or delete by a fuzzed request changes it. One round trip: it
 * runs after every fuzzed request.
 */
export async function tableDigest(pool: pg.Pool): Promise<Record<string, string>> {
  const { rows: tables } = await pool.query<{ name: string }>(
    "select quote_ident(table_name) as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name",
  );
  const columns = tables.map(
    ({ name }) => `(select count(*)::text || ':' || coalesce(md5(string_agg(md5(t::text), '' order by md5(t::text))), '-') from ${name} t) as "${name.replace(/"/g, "")}"`,
  );
  const { rows } = await pool.query<Record<string, string>>(`select ${columns.join(", ")}`);
  return rows[0] ?? {};
}

/** The tables whose rows differ between two digests, for the failure message. */
export function changedTables(before: Record<string, string>, after: Record<string, string>): string[] {
  return Object.keys({ ...before, ...after }).filter((table) => before[table] !== after[table]);
}
