// The demo seed with every state (db/seed.ts, `everyState`): seeded twice into a fresh database, every
// state of every journey is present — compared with the enum lists of the schema, and with every
// enum column PostgreSQL knows of, so a new state without demo data fails here — and the second run,
// a few days later, changes nothing. The data is also checked against the product's rules from the
// outside: fees, refunds, verdicts and deadlines recomputed here, and the worker's own sweeps, run
// right after seeding, find nothing to change (so the states survive `npm start`).
import { readFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  APPLICATION_STATUSES,
  BRING_UP_STAGES,
  CAPTURE_STATES,
  CHECKOUT_STATUSES,
  CHECKPOINT_VERDICTS,
  DISPUTE_OUTCOMES,
  LISTING_DECISIONS,
  LISTING_KINDS,
  LISTING_STATES,
  LOG_VISIBILITIES,
  MAGNETIC_SUBTYPES,
  ORDER_STATES,
  POST_STATES,
  READING_VERDICTS,
  RESERVATION_STATUSES,
  RETURN_STATUSES,
  REVIEW_STATES,
  ROLES,
} from "@/db/schema";
import { seedDemo } from "@/db/seed";
import type { LogViewer } from "@/lib/bench/log-access";
import { freshDatabase } from "../../support/test-database";

const NOW = new Date();
const DAY_MS = 24 * 60 * 60 * 1000;
const HOUR_MS = 60 * 60 * 1000;

let database: Awaited<ReturnType<typeof freshDatabase>>;
let pool: pg.Pool;
const runs: { created: boolean }[] = [];
const snapshots: Map<string, { rows: number; digest: string }>[] = [];

async function tables(): Promise<string[]> {
  const { rows } = await pool.query<{ name: string }>(
    "select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not like '%drizzle%' order by 1",
  );
  return rows.map((r) => r.name);
}

/** Every table's row count and a digest of its rows, so an update is caught as well as an insert. */
async function snapshot(): Promise<Map<string, { rows: number; digest: string }>> {
  const out = new Map<string, { rows: number; digest: string }>();
  for (const name of await tables()) {
    const { rows } = await pool.query<{ n: number; digest: string | null }>(
      `select count(*)::int as n, md5(coalesce(string_agg(t::text, '|' order by t::text), '')) as digest from "${name}" t`,
    );
    out.set(name, { rows: rows[0]!.n, digest: rows[0]!.digest ?? "" });
  }
  return out;
}

async function distinct(table: string, column: string): Promise<string[]> {
  const { rows } = await pool.query<{ v: string }>(`select distinct ${column}::text as v from ${table} where ${column} is not null order by 1`);
  return rows.map((r) => r.v);
}

const sorted = (values: readonly string[]) => [...values].sort();

beforeAll(async () => {
  database = await freshDatabase("seed_demo_states");
  pool = new pg.Pool({ connectionString: database.url, max: 3 });
  runs.push(await seedDemo(database.url, { everyState: true, now: NOW }));
  snapshots.push(await snapshot());
  // `npm start` three days later seeds again: nothing may move.
  runs.push(await seedDemo(database.url, { everyState: true, now: new Date(NOW.getTime() + 3 * DAY_MS) }));
  snapshots.push(await snapshot());

  process.env.DATABASE_URL = database.url;
  // Nothing here should reach the payment provider; if something did, it would fail at once.
  process.env.STRIPE_API_URL = "http://127.0.0.1:9";
  (await import("@/lib/env"))._resetEnvForTests();
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool?.end();
  await database?.drop();
});

describe("the demo seed with every state", () => {
  it("creates the scenario on the first run and changes no row of any table on the second", () => {
    expect(runs).toEqual([{ created: true }, { created: false }]);
    const [first, second] = snapshots;
    expect([...second!.keys()]).toEqual([...first!.keys()]);
    for (const [name, before] of first!) expect({ name, ...second!.get(name) }).toEqual({ name, ...before });
    // The scenario is more than the base: orders, logs, reviews and posts are there.
    for (const name of ["orders", "readings", "review_sessions", "questions", "answers", "policy_revisions"]) expect(first!.get(name)!.rows).toBeGreaterThan(0);
  });

  // Each column against the list its schema declares, so a state added to the schema fails until the demo shows it.
  const STATE_COLUMNS: [string, string, readonly string[]][] = [
    ["listings", "state", LISTING_STATES],
    ["listings", "kind", LISTING_KINDS],
    ["listings", "magnetic_subtype", MAGNETIC_SUBTYPES],
    ["listing_decisions", "decision", LISTING_DECISIONS],
    ["orders", "state", ORDER_STATES],
    ["checkouts", "status", CHECKOUT_STATUSES],
    ["stock_reservations", "status", RESERVATION_STATUSES],
    ["return_requests", "status", RETURN_STATUSES],
    ["bring_up_logs", "visibility", LOG_VISIBILITIES],
    ["log_checkpoints", "stage", BRING_UP_STAGES],
    ["readings", "verdict", READING_VERDICTS],
    ["captures", "state", CAPTURE_STATES],
    ["questions", "state", POST_STATES],
    ["answers", "state", POST_STATES],
    ["review_sessions", "state", REVIEW_STATES],
    ["review_verdicts", "verdict", CHECKPOINT_VERDICTS],
    ["review_disputes", "outcome", DISPUTE_OUTCOMES],
    ["seller_applications", "status", APPLICATION_STATUSES],
    ["reviewer_applications", "status", APPLICATION_STATUSES],
    ["user_roles", "role", ROLES],
  ];
  it.each(STATE_COLUMNS)("%s.%s holds every value of its schema list", async (table, column, values) => {
    expect(await distinct(table, column)).toEqual(sorted(values));
  });

  // Enumerations that name a kind of thing rather than a state; the demo need not show each.
  const NOT_STATES: Record<string, string> = {
    upload_purpose: "what a file is for; the demo has photos and captures, not documents",
    document_kind: "the kind of a listing document; the demo lists none",
    post_kind: "question or answer, on flags and photos",
    mail_status: "the outbox's delivery state; the seed queues no mail (what people do in the demo does)",
  };
  it("covers every value of every enum column in the database, not only the ones listed above", async () => {
    const { rows } = await pool.query<{ table_name: string; column_name: string; type: string; labels: string[] }>(`
      select c.table_name, c.column_name, c.udt_name as type,
             (select array_agg(e.enumlabel::text order by e.enumsortorder) from pg_enum e join pg_type t on t.oid = e.enumtypid where t.typname = c.udt_name) as labels
      from information_schema.columns c
      where c.table_schema = 'public' and c.data_type = 'USER-DEFINED'
        and exists (select 1 from pg_type t where t.typname = c.udt_name and t.typtype = 'e')
      order by 1, 2`);
    expect(rows.length).toBeGreaterThan(15);
    const missing: string[] = [];
    for (const r of rows) {
      if (NOT_STATES[r.type]) continue;
      const present = await distinct(r.table_name, r.column_name);
      const absent = r.labels.filter((l) => !present.includes(l));
      if (absent.length > 0) missing.push(`${r.table_name}.${r.column_name}: ${absent.join(", ")}`);
    }
    expect(missing).toEqual([]);
  });

  it("shows a reading far outside its range as well as ones a little off", async () => {
    const { rows } = await pool.query("select verdict::text, far_outside from readings group by 1, 2 order by 1, 2");
    expect(rows).toEqual([
      { verdict: "high", far_outside: false },
      { verdict: "high", far_outside: true },
      { verdict: "low", far_outside: false },
      { verdict: "within", far_outside: false },
    ]);
  });
});

describe("the scenario keeps the product's rules", () => {
  it("splits every order's subtotal into the 8 % platform fee, rounded half up, and the seller's share", async () => {
    const { rows } = await pool.query("select number, subtotal_minor, fee_minor, seller_share_minor from orders");
    expect(rows.length).toBeGreaterThanOrEqual(ORDER_STATES.length);
    for (const o of rows) {
      // PRODUCT.md: the platform fee is kept and the rest goes to the seller; 800 bps, half a cent rounds up.
      expect(o.fee_minor, o.number).toBe(Math.floor((o.subtotal_minor * 800 + 5_000) / 10_000));
      expect(o.fee_minor + o.seller_share_minor, o.number).toBe(o.subtotal_minor);
    }
    // A worked example by hand: the 160 A kit at €189.00 pays a €15.12 fee.
    const kit = await pool.query("select fee_minor from orders o join order_lines l on l.order_id = o.id where l.unit_price_minor = 18900 and l.quantity = 1 and o.subtotal_minor = 18900 limit 1");
    expect(kit.rows[0].fee_minor).toBe(1512);
  });

  it("counts refunds into lines and orders, and calls an order refunded exactly when all of it went back", async () => {
    const { rows } = await pool.query(`
      select o.number, o.state::text, o.subtotal_minor, o.refunded_minor,
             (select coalesce(sum(amount_minor), 0)::int from refunds r where r.order_id = o.id) as refunds,
             (select coalesce(sum(refunded_minor), 0)::int from order_lines l where l.order_id = o.id) as lines,
             (select bool_and(refunded_minor <= unit_price_minor * quantity) from order_lines l where l.order_id = o.id) as within
      from orders o`);
    for (const o of rows) {
      expect(o.refunds, o.number).toBe(o.refunded_minor);
      expect(o.lines, o.number).toBe(o.refunded_minor);
      expect(o.within, o.number).toBe(true);
      if (o.state === "refunded") expect(o.refunded_minor, o.number).toBe(o.subtotal_minor);
      if (o.state !== "refunded" && o.state !== "cancelled") expect(o.refunded_minor, o.number).toBeLessThan(o.subtotal_minor);
    }
    // A partial refund on a delivered order and a full one are both in the demo.
    expect(rows.some((o) => o.state === "delivered" && o.refunded_minor > 0)).toBe(true);
    expect(rows.filter((o) => o.state === "refunded").length).toBeGreaterThanOrEqual(2);
  });

  it("keeps a mains-connected item's acknowledgement with the hazards the buyer read", async () => {
    const { rows } = await pool.query(
      "select a.hazards from order_acknowledgements a join listings l on l.id = a.listing_id where l.slug = '160a-half-bridge-stick-welder-kit'",
    );
    expect(rows.length).toBeGreaterThan(0);
    // √2 · 230 V · 1.1 = 357.8 V (IEC 60038's +10 %); ½ · 1360 µF · (357.8 V)² = 87.05 J;
    // 33 kΩ · 1360 µF · ln(357.8 / 60) = 80.1 s, shown rounded up.
    for (const r of rows) {
      expect(r.hazards).toEqual(["connects to 230 V mains", "its bus reaches 358 V and stores 87.1 J", "the bus needs 81 s to fall below 60 V after unplugging", "heatsinks are live", "it is a welding source with 62 V open-circuit output"]);
    }
  });

  it("marks each reading against its checkpoint's range, far outside past a quarter of the range's width", async () => {
    // The quarter-width margin is lib/engineering's rule (common practice); recomputed here in SQL.
    const { rows } = await pool.query(`
      select r.value, c.expected_min as min, c.expected_max as max, r.verdict::text, r.far_outside,
             case when r.value < c.expected_min then 'low' when r.value > c.expected_max then 'high' else 'within' end as expected,
             greatest(c.expected_min - r.value, r.value - c.expected_max, 0) > 0.25 * (c.expected_max - c.expected_min) as far
      from readings r join log_checkpoints c on c.id = r.checkpoint_id`);
    expect(rows.length).toBeGreaterThan(20);
    for (const r of rows) expect({ verdict: r.verdict, far: r.far_outside }).toEqual({ verdict: r.expected, far: r.far });
  });

  it("prices each review at the reviewer's €45.00 with the 8 % fee, and refunds no more than was paid", async () => {
    const { rows } = await pool.query("select state::text, price_minor, fee_minor, reviewer_share_minor, refunded_minor from review_sessions");
    for (const s of rows) {
      expect([s.price_minor, s.fee_minor, s.reviewer_share_minor]).toEqual([4500, 360, 4140]);
      expect(s.refunded_minor).toBeLessThanOrEqual(s.price_minor);
    }
    const { rows: disputes } = await pool.query("select outcome::text, refund_minor from review_disputes order by outcome");
    expect(disputes).toEqual([
      { outcome: "closed_payment_stands", refund_minor: null },
      { outcome: "open", refund_minor: null },
      { outcome: "refunded_full", refund_minor: 4500 },
      { outcome: "refunded_partial", refund_minor: 1500 },
    ]);
  });

  it("gives every delivered report one verdict per checkpoint of the booked stages", async () => {
    const { rows } = await pool.query(`
      select s.id,
             (select count(*)::int from review_verdicts v where v.session_id = s.id) as verdicts,
             (select count(*)::int from log_checkpoints c where c.log_id = s.log_id and c.stage::text in (select jsonb_array_elements_text(s.stages))) as in_scope
      from review_sessions s where s.delivered_at is not null`);
    expect(rows.length).toBeGreaterThanOrEqual(5);
    for (const r of rows) expect(r.verdicts).toBe(r.in_scope);
  });

  it("has a policy revision in force whose grace period is running for one live listing, and one listing held when an earlier grace ran out", async () => {
    const { rows: revisions } = await pool.query("select revision, grace_days, published_at from policy_revisions order by revision");
    expect(revisions.map((r) => r.revision)).toEqual([2, 3]);
    const third = revisions[1]!;
    const { rows: running } = await pool.query("select state::text, grace_until, policy_revision, policy_status from listings where grace_until > now()");
    expect(running).toHaveLength(1);
    expect(running[0]).toMatchObject({ state: "live", policy_revision: 3, policy_status: "incomplete" });
    expect(running[0].grace_until.getTime()).toBe(third.published_at.getTime() + third.grace_days * DAY_MS);
    const { rows: held } = await pool.query(`
      select l.state::text, l.grace_until from listings l
      where exists (select 1 from listing_decisions d where d.listing_id = l.id and d.decision = 'grace_expired')`);
    expect(held).toHaveLength(1);
    expect(held[0].state).toBe("held");
    expect(held[0].grace_until.getTime()).toBeLessThan(NOW.getTime());
    const { rows: results } = await pool.query("select revision, count(*) filter (where status <> 'clear')::int as failing, count(*) filter (where held_at is not null)::int as held from policy_recheck_results group by 1 order by 1");
    expect(results).toEqual([
      { revision: 2, failing: 1, held: 1 },
      { revision: 3, failing: 1, held: 0 },
    ]);
  });

  it("writes an audit entry beside each seeded decision", async () => {
    const { rows } = await pool.query("select action from audit_log group by 1 order by 1");
    const actions = rows.map((r) => r.action);
    for (const action of [
      "listing.grace_notice",
      "listing.grace_expired",
      "listing.restored",
      "listing.retired",
      "policy.published",
      "order.shipped",
      "order.delivered",
      "order.cancelled",
      "order.refund_settled",
      "refund.transfer_reversed",
      "order.return_requested",
      "order.return_accepted",
      "order.return_declined",
      "review.booked",
      "review.declined",
      "review.expired",
      "review.delivered",
      "review.disputed",
      "review.dispute_settled",
      "review.closed",
      "question.approved",
      "question.hidden",
      "question.removed",
      "answer.hidden",
      "answer.removed",
      "answer.restored",
      "seller.declined",
      "reviewer.approved",
      "reviewer.declined",
    ]) {
      expect(actions, action).toContain(action);
    }
    // Decisions and their audit entries come in pairs (listing-transitions.ts writes both).
    const { rows: pairs } = await pool.query(`
      select d.decision::text, count(*)::int as n,
             (select count(*)::int from audit_log a where a.action = 'listing.' || d.decision::text and a.subject_type = 'listing') as audited
      from listing_decisions d group by d.decision`);
    for (const p of pairs) expect(p.audited, p.decision).toBe(p.n);
  });
});

describe("the states survive the worker", () => {
  it("places time-bound states inside their windows", async () => {
    const one = async (sql: string) => (await pool.query(sql)).rows[0];
    const requested = await one("select created_at, respond_by from review_sessions where state = 'requested'");
    // The reviewer answers within 48 hours (lib/reviews/transitions.ts, from the product brief).
    expect(requested.respond_by.getTime()).toBe(requested.created_at.getTime() + 48 * HOUR_MS);
    expect(requested.respond_by.getTime()).toBeGreaterThan(NOW.getTime());
    const delivered = await one("select delivered_at, dispute_by from review_sessions where state = 'delivered'");
    expect(delivered.dispute_by.getTime()).toBe(delivered.delivered_at.getTime() + 7 * DAY_MS);
    expect(delivered.dispute_by.getTime()).toBeGreaterThan(NOW.getTime());
    const open = await one("select expires_at from checkouts where status = 'open'");
    expect(open.expires_at.getTime()).toBeGreaterThan(NOW.getTime());
  });

  it("leaves nothing for the sweeps to expire, close, capture, release, transfer, refund, hold or measure", async () => {
    const reviews = await import("@/db/queries/reviews");
    const checkout = await import("@/db/queries/checkout");
    const moderation = await import("@/db/queries/moderation");
    const orders = await import("@/db/queries/orders");
    const captures = await import("@/db/queries/captures");
    expect(await reviews.sessionsDueForExpiry(NOW)).toEqual([]);
    expect(await reviews.sessionsDueForClosing(NOW)).toEqual([]);
    expect(await reviews.releasesDue()).toEqual([]);
    expect(await reviews.collectionsDue()).toEqual([]);
    expect(await checkout.transfersDue()).toEqual([]);
    expect(await checkout.lateRefundsDue()).toEqual([]);
    expect(await checkout.overdueCheckouts(NOW, 2 * 60_000)).toEqual([]);
    expect(await moderation.listingsPastGrace(NOW)).toEqual([]);
    expect(await captures.strandedCaptureIds()).toEqual([]);
    expect(await orders.settlePendingRefunds({ olderThanMs: 0 })).toEqual({ refunded: 0, pending: 0, failed: 0, reversed: 0 });
  });

  it("puts revision 3 in force for the app", async () => {
    const { currentPolicyRevision } = await import("@/db/queries/policy");
    expect((await currentPolicyRevision()).revision).toBe(3);
  });
});

describe("the demo's scope captures are the app's own measurements", () => {
  const BUILDER: LogViewer = { id: "demo-builder", roles: ["member"] };
  const REVIEWER: LogViewer = { id: "demo-reviewer", roles: ["member", "reviewer"] };
  const one = async (sql: string, params: unknown[] = []) => (await pool.query(sql, params)).rows[0];

  it("offers each capture's original as the very file in public/demo that the generator writes", async () => {
    const { DEMO_CAPTURE_FILES } = await import("@/db/seed-capture-files");
    const { rows } = await pool.query("select u.url, u.bytes, u.original_name, u.purpose::text from captures c join uploads u on u.key = c.upload_key order by c.created_at");
    expect(rows).toHaveLength(DEMO_CAPTURE_FILES.length);
    for (const make of DEMO_CAPTURE_FILES) {
      const { file, text } = make();
      // `npx tsx db/seed-capture-files.ts` writes them again after a change to the generator.
      const onDisk = readFileSync(path.resolve(import.meta.dirname, "../../../public/demo", file), "utf8");
      expect(onDisk === text, `public/demo/${file} is the generator's output`).toBe(true);
      expect(rows.find((r) => r.url === `/demo/${file}`)).toEqual({ url: `/demo/${file}`, bytes: Buffer.byteLength(text), original_name: file, purpose: "capture" });
    }
  });

  it("stores for the measured capture exactly what the app's measuring stores: figures, ranges and sample blocks", async () => {
    const { measureText } = await import("@/lib/captures/measure");
    const { firstBoardGateDrive } = await import("@/db/seed-capture-files");
    const expected = await measureText(firstBoardGateDrive().text, async () => {});
    const capture = await one("select * from captures where state = 'measured'");
    expect({
      sampleCount: capture.sample_count,
      startTimeS: capture.start_time_s,
      endTimeS: capture.end_time_s,
      sampleIntervalS: capture.sample_interval_s,
      evenlySpaced: capture.evenly_spaced,
      progress: capture.progress,
    }).toEqual({ ...pick(expected, ["sampleCount", "startTimeS", "endTimeS", "sampleIntervalS", "evenlySpaced"]), progress: 100 });
    const { rows: channels } = await pool.query("select name, unit, min_value, max_value, figures from capture_channels where capture_id = $1 order by position", [capture.id]);
    expect(channels.map((c) => ({ name: c.name, unit: c.unit, minValue: c.min_value, maxValue: c.max_value, figures: c.figures }))).toEqual(expected.channels);
    const { rows: blocks } = await pool.query("select series, block, first_index, sample_count, first_time_s, last_time_s, data from capture_blocks where capture_id = $1 order by block, series", [capture.id]);
    expect(blocks.map((b) => ({ series: b.series, block: b.block, firstIndex: b.first_index, sampleCount: b.sample_count, firstTimeS: b.first_time_s, lastTimeS: b.last_time_s, data: b.data }))).toEqual(
      [...expected.blocks].sort((a, b) => a.block - b.block || a.series - b.series),
    );
  });

  it("measures log 1's gate drive at the 40.1 kHz and 46 % its readings say, and proposes the frequency reading's value from it", async () => {
    const queries = await import("@/db/queries/captures");
    const { captureStatusView } = await import("@/lib/captures/status-view");
    const { id } = await one("select id from captures where state = 'measured'");
    // What a visitor of the public log sees, through the app's own read.
    const detail = await queries.captureForViewer(null, id);
    expect(detail).not.toBeNull();
    expect(detail!.log.title).toBe("Stick welder from the yard kit");
    expect(detail!.checkpoint.name).toBe("Gate-drive frequency");
    const duty = await one("select r.value from readings r join log_checkpoints c on c.id = r.checkpoint_id where r.log_id = $1 and c.name = 'Gate-drive duty cycle'", [detail!.log.id]);
    expect(detail!.channels.map((c) => c.name)).toEqual(["Q1 gate", "Q2 gate"]);
    for (const c of detail!.channels) {
      expect(c.figures.frequencyHz! / 1000).toBeCloseTo(detail!.reading.value, 1);
      expect(c.figures.dutyCyclePct!).toBeCloseTo(duty.value, 0);
    }
    const view = captureStatusView(detail!);
    expect(view.applied).toBeNull();
    expect(view.proposal).toMatchObject({ ok: true, figure: "frequencyHz" });
    const options = view.proposal!.ok ? view.proposal!.options : [];
    expect(options.map((o) => o.channelName)).toEqual(["Q1 gate", "Q2 gate"]);
    for (const o of options) {
      expect(o.unit).toBe("kHz");
      expect(o.value).toBeGreaterThanOrEqual(detail!.checkpoint.expectedMin);
      expect(o.value).toBeLessThanOrEqual(detail!.checkpoint.expectedMax);
    }
    // The viewer's zoom reads the samples back from the blocks.
    const window = await queries.readCaptureSamples(detail!.capture, 0, 25e-6, [0, 1]);
    expect(window.timeS.length).toBeGreaterThan(400);
  });

  it("keeps the failed capture's reason as the parser gives it, naming the line where time goes backwards", async () => {
    const { parseCaptureCsv } = await import("@/lib/engineering");
    const { appendedRecords } = await import("@/db/seed-capture-files");
    const capture = await one("select error_message from captures where state = 'failed'");
    expect(() => parseCaptureCsv(appendedRecords().text)).toThrow(capture.error_message);
    expect(capture.error_message).toMatch(/^Line \d+: time goes backwards \(.+\); the time column must increase\.$/);
  });

  it("pins the reviewer's comments from the delivered session to the trace: the builder and the reviewer read them, a visitor does not", async () => {
    const queries = await import("@/db/queries/captures");
    const capture = await one("select id, start_time_s, end_time_s from captures where state = 'measured'");
    const builderPins = await queries.pinsFor(capture.id, BUILDER, "owner");
    expect(builderPins).toHaveLength(2);
    for (const p of builderPins) {
      expect(p.timeS).toBeGreaterThanOrEqual(capture.start_time_s);
      expect(p.timeS).toBeLessThanOrEqual(capture.end_time_s);
    }
    expect(await queries.pinsFor(capture.id, REVIEWER, "reviewer")).toHaveLength(2);
    expect(await queries.pinsFor(capture.id, null, "public")).toEqual([]);
    const { rows } = await pool.query(
      "select s.state::text, p.created_at > s.accepted_at and p.created_at < s.delivered_at as while_writing from capture_pins p join review_sessions s on s.id = p.session_id",
    );
    expect(rows).toEqual([
      { state: "delivered", while_writing: true },
      { state: "delivered", while_writing: true },
    ]);
  });

  it("keeps the waiting captures out of the worker's sweep for years, since the worker cannot fetch a site-relative demo file", async () => {
    const { rows } = await pool.query("select state::text, updated_at from captures where state in ('queued', 'measuring') order by state");
    expect(rows.map((r) => r.state)).toEqual(["measuring", "queued"]);
    for (const r of rows) expect(r.updated_at.getTime()).toBeGreaterThan(NOW.getTime() + 5 * 365 * DAY_MS);
  });
});

function pick<T extends object, K extends keyof T>(value: T, keys: K[]): Pick<T, K> {
  return Object.fromEntries(keys.map((k) => [k, value[k]])) as Pick<T, K>;
}
