// The rows the access matrix's paths name (tests/support/access-matrix.ts), written straight into a
// seeded database with SQL, and removed again afterwards so the other browser tests meet the demo
// data as the seed left it. Listings are copies of the seeded kit (every column, a new id, slug and
// state), so they render like any other listing whatever the seed's columns are by then.
import { randomBytes, randomUUID } from "node:crypto";
import type pg from "pg";
import { DEMO_LISTINGS } from "../../db/seed-listings";
import { PERSONA_USER_IDS } from "./access-matrix";

export type AccessFixtures = {
  listingSlug: string;
  ownListing: string;
  reviewListing: string;
  order: string;
  returnRequest: string;
  checkout: string;
  checkoutSession: string;
  log: string;
  review: string;
  question: string;
  capture: string;
  missing: string;
  memberId: string;
};

const SELLER = PERSONA_USER_IDS.sellerOwner;
const BUYER = PERSONA_USER_IDS.member;
const REVIEWER = PERSONA_USER_IDS.reviewer;

/** The seeded live kit of sellerOwner with bring-up checkpoints: the template for the fixtures' listings and log. */
export function templateKit(): { id: string; title: string } {
  const kit = DEMO_LISTINGS.find((l) => l.sellerId === SELLER && l.kind === "kit" && l.state === "live" && (l.checkpoints?.length ?? 0) > 0);
  if (!kit) throw new Error("the demo seed has no live kit with checkpoints of demo-seller-kits to copy");
  return { id: kit.id, title: kit.title };
}

/** A copy of a listing with a new id, slug and state; returns the id. */
export async function copyListing(pool: pg.Pool, sourceId: string, state: string, tag: string, overrides: Record<string, unknown> = {}): Promise<{ id: string; slug: string }> {
  const id = randomUUID();
  const slug = `access-matrix-${state.replace(/_/g, "-")}-${tag}`;
  const changes = { id, slug, state, submitted_at: state === "draft" ? null : new Date().toISOString(), ...overrides };
  // Generated columns (mains_connected, search_vector) are computed by PostgreSQL and cannot be written.
  const { rows } = await pool.query<{ name: string }>(
    "select quote_ident(column_name) as name from information_schema.columns where table_schema = current_schema() and table_name = 'listings' and is_generated = 'NEVER' order by ordinal_position",
  );
  const columns = rows.map((r) => r.name).join(", ");
  await pool.query(
    `insert into listings (${columns}) select ${columns} from jsonb_populate_record(null::listings, (select to_jsonb(l) || $2::jsonb from listings l where l.id = $1))`,
    [sourceId, JSON.stringify(changes)],
  );
  return { id, slug };
}

export async function createAccessFixtures(pool: pg.Pool): Promise<AccessFixtures> {
  const tag = randomBytes(3).toString("hex");
  const kit = templateKit();
  const live = await copyListing(pool, kit.id, "live", tag);
  const draft = await copyListing(pool, kit.id, "draft", tag, { stock: 3, live_at: null });
  const inReview = await copyListing(pool, kit.id, "in_review", tag, { live_at: null });

  // member's order from sellerOwner, paid, shipped and delivered; a return was asked for and declined.
  const checkout = randomUUID();
  const checkoutSession = `cs_access_matrix_${tag}`;
  await pool.query(
    `insert into checkouts (id, buyer_id, email, currency, total_minor, fee_bps, status, session_id, expires_at, paid_at)
     values ($1, $2, $3, 'EUR', 18900, 800, 'paid', $4, now() + interval '1 hour', now())`,
    [checkout, BUYER, "noor.builds@larkspur.test", checkoutSession],
  );
  const order = randomUUID();
  await pool.query(
    `insert into orders (id, number, checkout_id, buyer_id, seller_id, state, currency, subtotal_minor, fee_minor, seller_share_minor, carrier, tracking_ref, paid_at, shipped_at, delivered_at)
     values ($1, $2, $3, $4, $5, 'delivered', 'EUR', 18900, 1512, 17388, 'Yard Post', 'YP-ACCESS', now() - interval '3 days', now() - interval '2 days', now() - interval '1 day')`,
    [order, `FY-AM-${tag.toUpperCase()}`, checkout, BUYER, SELLER],
  );
  await pool.query("insert into order_lines (order_id, listing_id, title, unit_price_minor, quantity, sheet_revision) values ($1, $2, $3, 18900, 1, 1)", [order, live.id, kit.title]);
  const { rows: returns } = await pool.query(
    "insert into return_requests (order_id, reason, status, decision_reason, decided_at, created_at) values ($1, 'Changed my mind about the build.', 'declined', 'Opened kits cannot go back.', now(), now() - interval '1 hour') returning id",
    [order],
  );
  await pool.query("insert into return_requests (order_id, reason) values ($1, 'The choke hums at idle; asking to send it back.')", [order]);

  // member's private log of the kit, with the kit's checkpoints, and an accepted review of it by reviewer.
  const { rows: logs } = await pool.query("insert into bring_up_logs (owner_id, kit_listing_id, title) values ($1, $2, $3) returning id", [BUYER, live.id, `Access matrix build ${tag}`]);
  const log = logs[0].id as string;
  await pool.query(
    `insert into log_checkpoints (log_id, source_checkpoint_id, position, stage, name, measure, unit, expected_min, expected_max)
     select $1, id, position, stage, name, measure, unit, expected_min, expected_max from listing_checkpoints where listing_id = $2`,
    [log, kit.id],
  );
  const { rows: reviews } = await pool.query(
    `insert into review_sessions (log_id, builder_id, reviewer_id, stages, state, price_minor, currency, fee_bps, fee_minor, reviewer_share_minor, respond_by, accepted_at)
     values ($1, $2, $3, '["series-lamp"]', 'accepted', 4500, 'EUR', 1000, 450, 4050, now() + interval '2 days', now()) returning id`,
    [log, BUYER, REVIEWER],
  );

  // A scope capture on a reading of the log, whose measuring failed (so no worker picks it up).
  const { rows: readings } = await pool.query(
    `insert into readings (log_id, checkpoint_id, value, entered_value, entered_unit, verdict, instrument)
     select $1, id, expected_min, expected_min, unit, 'within', 'Bench scope' from log_checkpoints where log_id = $1 order by position limit 1 returning id`,
    [log],
  );
  const uploadKey = `access-matrix-capture-${tag}`;
  await pool.query(
    "insert into uploads (key, owner_id, purpose, original_name, content_type, bytes, url) values ($1, $2, 'capture', 'scope.csv', 'text/csv', 120, $3)",
    [uploadKey, BUYER, `http://127.0.0.1:9/f/${uploadKey}`],
  );
  const { rows: captures } = await pool.query(
    "insert into captures (log_id, reading_id, upload_key, state, error_message) values ($1, $2, $3, 'failed', 'Line 1 is not a header of time and channel columns.') returning id",
    [log, readings[0].id, uploadKey],
  );

  // member's question, waiting for a moderator.
  const { rows: questions } = await pool.query(
    "insert into questions (author_id, title, body_md, state) values ($1, $2, 'How long should the series lamp glow at first power-up?', 'pending') returning id",
    [BUYER, `Series lamp glow time ${tag}`],
  );

  return {
    listingSlug: live.slug,
    ownListing: draft.id,
    reviewListing: inReview.id,
    order,
    returnRequest: returns[0].id as string,
    checkout,
    checkoutSession,
    log,
    review: reviews[0].id as string,
    question: questions[0].id as string,
    capture: captures[0].id as string,
    missing: randomUUID(),
    memberId: BUYER,
  };
}

/** Removes the fixtures and anything hung off them (in the order the foreign keys ask for). */
export async function removeAccessFixtures(pool: pg.Pool, f: AccessFixtures): Promise<void> {
  const listings = [f.ownListing, f.reviewListing];
  const { rows } = await pool.query("select id from listings where slug = $1", [f.listingSlug]);
  if (rows[0]) listings.push(rows[0].id as string);
  await pool.query("delete from questions where id = $1", [f.question]);
  await pool.query("delete from review_sessions where id = $1", [f.review]);
  const { rows: uploads } = await pool.query("delete from captures where log_id = $1 returning upload_key", [f.log]);
  await pool.query("delete from uploads where key = any($1::text[])", [uploads.map((u) => u.upload_key as string)]);
  await pool.query("delete from bring_up_logs where id = $1", [f.log]);
  await pool.query("delete from return_requests where order_id = $1", [f.order]);
  await pool.query("delete from order_lines where order_id = $1", [f.order]);
  await pool.query("delete from orders where id = $1", [f.order]);
  await pool.query("delete from checkouts where id = $1", [f.checkout]);
  await pool.query("delete from listings where id = any($1::uuid[])", [listings]);
}

/** A database session per person, as Auth.js's database strategy keeps them; returns the tokens. */
export async function createSessions(pool: pg.Pool): Promise<Record<keyof typeof PERSONA_USER_IDS, string>> {
  const tokens = {} as Record<keyof typeof PERSONA_USER_IDS, string>;
  for (const [persona, userId] of Object.entries(PERSONA_USER_IDS) as [keyof typeof PERSONA_USER_IDS, string][]) {
    const token = randomBytes(32).toString("hex");
    await pool.query("insert into sessions (session_token, user_id, expires) values ($1, $2, now() + interval '1 day')", [token, userId]);
    tokens[persona] = token;
  }
  return tokens;
}

export async function removeSessions(pool: pg.Pool, tokens: Record<string, string>): Promise<void> {
  await pool.query("delete from sessions where session_token = any($1::text[])", [Object.values(tokens)]);
}
