// Bring-up logs against the real PostgreSQL: starting from the demo kit, classification at the
// range bounds with unit conversion, refusals that write nothing, and who may read a log.
import { randomUUID } from "node:crypto";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { freshDatabase } from "../../support/test-database";

const DEMO_KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const KIT_IN_REVIEW = "0b7d1c3e-5a21-4c6e-9f10-000000000006";
const builder = { id: "demo-builder", roles: ["member"] as const };
const otherMember = { id: "demo-seller-magnetics", roles: ["seller"] as const };
const reviewer = { id: "demo-reviewer", roles: ["reviewer"] as const };
const moderator = { id: "demo-moderator", roles: ["moderator"] as const };

let database: Awaited<ReturnType<typeof freshDatabase>>;
let pool: pg.Pool;
type Bench = typeof import("@/db/queries/bench");
let bench: Bench;

async function count(sql: string, params: unknown[] = []): Promise<number> {
  const { rows } = await pool.query(`select count(*)::int as n from ${sql}`, params);
  return rows[0].n;
}

/** A paid order of one listing for the buyer, as checkout leaves it. */
async function paidOrder(buyerId: string, listingId: string, state = "paid") {
  const checkout = randomUUID();
  const order = randomUUID();
  await pool.query(
    "insert into checkouts (id, buyer_id, email, currency, total_minor, fee_bps, status, expires_at, paid_at) values ($1, $2, 'noor.builds@larkspur.test', 'EUR', 18900, 800, 'paid', now() + interval '1 hour', now())",
    [checkout, buyerId],
  );
  await pool.query(
    "insert into orders (id, number, checkout_id, buyer_id, seller_id, state, currency, subtotal_minor, fee_minor, seller_share_minor) values ($1, $2, $3, $4, 'demo-seller-kits', $5, 'EUR', 18900, 1512, 17388)",
    [order, `T-${order.slice(0, 8)}`, checkout, buyerId, state],
  );
  await pool.query("insert into order_lines (order_id, listing_id, title, unit_price_minor, quantity, sheet_revision) values ($1, $2, 'Kit', 18900, 1, 1)", [
    order,
    listingId,
  ]);
}

async function readingPhoto(ownerId: string, purpose = "reading-photo"): Promise<string> {
  const key = `test-${randomUUID()}`;
  await pool.query(
    "insert into uploads (key, owner_id, purpose, original_name, content_type, bytes, url, thumb_url) values ($1, $2, $3, 'bench.png', 'image/png', 1000, $4, $5)",
    [key, ownerId, purpose, `http://uploads.test/f/${key}`, `http://uploads.test/f/${key}-thumb`],
  );
  return key;
}

async function checkpointNamed(logId: string, name: string) {
  const found = (await bench.logCheckpointsOf(logId)).find((c) => c.name === name);
  if (!found) throw new Error(`no checkpoint ${name}`);
  return found;
}

beforeAll(async () => {
  database = await freshDatabase("bench_logs");
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  pool = new pg.Pool({ connectionString: database.url });
  bench = await import("@/db/queries/bench");
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool.end();
  await database.drop();
});

describe("starting a log", () => {
  it("from the demo kit copies its 9 checkpoints, in bring-up order, in one go", async () => {
    const { id, checkpoints } = await bench.createLog(builder.id, { kitListingId: DEMO_KIT, title: "" });
    expect(checkpoints).toBe(9);
    const copied = await bench.logCheckpointsOf(id);
    const { rows: source } = await pool.query("select id, stage, name, unit, expected_min, expected_max from listing_checkpoints where listing_id = $1 order by position", [DEMO_KIT]);
    expect(copied.map((c) => [c.sourceCheckpointId, c.stage, c.name, c.unit, c.expectedMin, c.expectedMax])).toEqual(
      source.map((s) => [s.id, s.stage, s.name, s.unit, s.expected_min, s.expected_max]),
    );
    expect(copied.map((c) => c.stage)).toEqual([...Array(3).fill("control-supply"), ...Array(3).fill("series-lamp"), "low-current", "rated-load", "rated-load"]);
    expect(copied.every((c) => !c.addedByBuilder)).toBe(true);
    // The title falls back to the kit's; the log starts private.
    const { rows } = await pool.query("select l.title, l.visibility, l.owner_id, k.title as kit_title from bring_up_logs l join listings k on k.id = l.kit_listing_id where l.id = $1", [id]);
    expect(rows[0]).toEqual({ title: rows[0].kit_title, kit_title: "160 A half-bridge stick-welder kit", visibility: "private", owner_id: builder.id });
  });

  it("for a build of one's own starts empty, and the builder's checkpoints go to the end of their stage", async () => {
    const { id, checkpoints } = await bench.createLog(builder.id, { kitListingId: "", title: "Bench supply, first board" });
    expect(checkpoints).toBe(0);
    await bench.addCheckpoint(builder, id, { stage: "rated-load", name: "Output ripple", measure: "Ripple at 5 A", unit: "mV", expectedMin: 0, expectedMax: 50 });
    await bench.addCheckpoint(builder, id, { stage: "control-supply", name: "Aux rail", measure: "12 V rail", unit: "V", expectedMin: 11.4, expectedMax: 12.6 });
    const list = await bench.logCheckpointsOf(id);
    expect(list.map((c) => [c.stage, c.name, c.addedByBuilder])).toEqual([
      ["control-supply", "Aux rail", true],
      ["rated-load", "Output ripple", true],
    ]);
  });

  it("offers the kits the builder bought first, and refuses a kit that is neither in the catalog nor bought", async () => {
    const before = await bench.kitChoicesFor(builder.id);
    expect(before.bought).toEqual([]);
    expect(before.catalog.map((k) => k.id)).toContain(DEMO_KIT);
    expect(before.catalog.map((k) => k.id)).not.toContain(KIT_IN_REVIEW);
    await expect(bench.createLog(builder.id, { kitListingId: KIT_IN_REVIEW, title: "" })).rejects.toMatchObject({ status: 404 });

    await paidOrder(builder.id, DEMO_KIT, "delivered");
    await paidOrder(builder.id, KIT_IN_REVIEW, "paid");
    const after = await bench.kitChoicesFor(builder.id);
    expect(after.bought.map((k) => k.id).sort()).toEqual([DEMO_KIT, KIT_IN_REVIEW].sort());
    expect(after.bought.find((k) => k.id === DEMO_KIT)?.checkpoints).toBe(9);
    expect(after.catalog.map((k) => k.id)).not.toContain(DEMO_KIT);
    // Bought here, so it may be logged even while the listing is back in review.
    await expect(bench.createLog(builder.id, { kitListingId: KIT_IN_REVIEW, title: "" })).resolves.toMatchObject({ checkpoints: 0 });
    // A cancelled order is not a purchase.
    await paidOrder(otherMember.id, KIT_IN_REVIEW, "cancelled");
    expect((await bench.kitChoicesFor(otherMember.id)).bought).toEqual([]);
  });
});

describe("recording readings", () => {
  let logId: string;
  beforeAll(async () => {
    logId = (await bench.createLog(builder.id, { kitListingId: DEMO_KIT, title: "Boundaries" })).id;
  });

  const record = async (name: string, value: number, unit: string) =>
    bench.recordReading(builder, logId, { checkpointId: (await checkpointNamed(logId, name)).id, value, unit, instrument: "", note: "", photos: [] });

  // Bounds are inclusive (issue 6: within / low / high against the expected range); far outside is
  // more than 25 % of the range width beyond a bound (common practice, lib/engineering/readings.ts).
  it("gate-drive frequency 38–42 kHz: exactly min and max are within, just outside is low or high", async () => {
    expect(await record("Gate-drive frequency", 38, "kHz")).toMatchObject({ verdict: "within", farOutside: false, value: 38 });
    expect(await record("Gate-drive frequency", 42, "kHz")).toMatchObject({ verdict: "within", value: 42 });
    expect(await record("Gate-drive frequency", 37.99, "kHz")).toMatchObject({ verdict: "low", farOutside: false });
    expect(await record("Gate-drive frequency", 42.01, "kHz")).toMatchObject({ verdict: "high", farOutside: false });
  });

  it("converts to the checkpoint's unit before classifying: 41 000 Hz is 41 kHz, within; 37 990 Hz is low", async () => {
    const recorded = await record("Gate-drive frequency", 41_000, "Hz");
    expect(recorded).toMatchObject({ verdict: "within", value: 41, unit: "kHz" });
    const { rows } = await pool.query("select value, entered_value, entered_unit, verdict from readings where id = $1", [recorded.id]);
    expect(rows[0]).toEqual({ value: 41, entered_value: 41_000, entered_unit: "Hz", verdict: "within" });
    expect(await record("Gate-drive frequency", 37_990, "Hz")).toMatchObject({ verdict: "low", value: 37.99 });
    expect(await record("Gate-drive frequency", 0.04201, "MHz")).toMatchObject({ verdict: "high", value: 42.01 });
  });

  it("bus voltage 290–335 V: 0.29 kV and 0.335 kV are within, 289.9 V low, 335.1 V high, 420 V far above", async () => {
    expect(await record("Bus voltage behind the lamp", 0.29, "kV")).toMatchObject({ verdict: "within", value: 290 });
    expect(await record("Bus voltage behind the lamp", 0.335, "kV")).toMatchObject({ verdict: "within", value: 335 });
    expect(await record("Bus voltage behind the lamp", 289.9, "V")).toMatchObject({ verdict: "low", farOutside: false });
    expect(await record("Bus voltage behind the lamp", 335.1, "V")).toMatchObject({ verdict: "high", farOutside: false });
    // 25 % of 45 V is 11.25 V beyond 335 V.
    expect(await record("Bus voltage behind the lamp", 420, "V")).toMatchObject({ verdict: "high", farOutside: true });
    expect(await record("Bus voltage behind the lamp", 346, "V")).toMatchObject({ verdict: "high", farOutside: false });
  });

  it("refuses an incompatible unit with a clear message and writes nothing", async () => {
    const before = await count("readings where log_id = $1", [logId]);
    const error = await record("Gate-drive frequency", 41, "V").catch((e: unknown) => e);
    expect(error).toBeInstanceOf(bench.BenchError);
    expect(error).toMatchObject({ status: 422, fieldErrors: { unit: [expect.stringContaining("V measures voltage, but this checkpoint measures frequency in kHz")] } });
    expect(await count("readings where log_id = $1", [logId])).toBe(before);
  });

  it("attaches only the owner's own reading photos; a stranger's photo refuses the whole reading", async () => {
    const checkpoint = await checkpointNamed(logId, "Open-circuit output");
    const mine = await readingPhoto(builder.id);
    const recorded = await bench.recordReading(builder, logId, { checkpointId: checkpoint.id, value: 62, unit: "V", instrument: "Meter, 200 V DC", note: "Steady", photos: [{ key: mine, alt: "Meter on the output" }] });
    const { rows } = await pool.query("select upload_key, caption from reading_photos where reading_id = $1", [recorded.id]);
    expect(rows).toEqual([{ upload_key: mine, caption: "Meter on the output" }]);

    const before = await count("readings where log_id = $1", [logId]);
    const theirs = await readingPhoto(otherMember.id);
    const listingPhoto = await readingPhoto(builder.id, "listing-photo");
    for (const key of [theirs, listingPhoto]) {
      await expect(bench.recordReading(builder, logId, { checkpointId: checkpoint.id, value: 60, unit: "V", instrument: "", note: "", photos: [{ key, alt: "" }] })).rejects.toMatchObject({ status: 403 });
    }
    // The same photo cannot be on two readings.
    await expect(bench.recordReading(builder, logId, { checkpointId: checkpoint.id, value: 60, unit: "V", instrument: "", note: "", photos: [{ key: mine, alt: "" }] })).rejects.toMatchObject({ status: 409 });
    expect(await count("readings where log_id = $1", [logId])).toBe(before);
  });

  it("refuses a checkpoint of another log", async () => {
    const other = await bench.createLog(builder.id, { kitListingId: DEMO_KIT, title: "Second board" });
    const foreign = await checkpointNamed(other.id, "Gate-drive frequency");
    await expect(bench.recordReading(builder, logId, { checkpointId: foreign.id, value: 40, unit: "kHz", instrument: "", note: "", photos: [] })).rejects.toMatchObject({ status: 404 });
  });

  it("the owner's view lists each checkpoint's readings and the progress of the newest ones", async () => {
    const view = await bench.getLogForViewer(builder, logId);
    expect(view).toMatchObject({ access: "owner", canEdit: true });
    const gate = view!.checkpoints.find((c) => c.name === "Gate-drive frequency")!;
    expect(gate.readings.at(-1)).toMatchObject({ value: 42.01, enteredValue: 0.04201, enteredUnit: "MHz", verdict: "high" });
    const output = view!.checkpoints.find((c) => c.name === "Open-circuit output")!;
    expect(output.readings[0]?.photos).toEqual([{ key: expect.any(String), url: expect.stringContaining("http://uploads.test/f/"), thumbUrl: expect.stringContaining("-thumb"), caption: "Meter on the output" }]);
    // Control supply: only the frequency is read, newest high; series lamp: bus (newest 346 V, high) and output (within).
    expect(view!.progress.map((p) => [p.stage, p.read, p.within, p.low, p.high])).toEqual([
      ["control-supply", 1, 0, 0, 1],
      ["series-lamp", 2, 1, 0, 1],
      ["low-current", 0, 0, 0, 0],
      ["rated-load", 0, 0, 0, 0],
    ]);
    const listed = (await bench.listLogs(builder.id)).find((l) => l.id === logId);
    expect(listed?.progress).toEqual(view!.progress);
  });
});

describe("who may read and change a log", () => {
  let logId: string;
  beforeAll(async () => {
    logId = (await bench.createLog(builder.id, { kitListingId: DEMO_KIT, title: "Private bring-up" })).id;
  });
  const attempt = async (actor: { id: string; roles: readonly ("member" | "seller" | "reviewer" | "moderator")[] }) =>
    bench.recordReading(actor, logId, { checkpointId: (await checkpointNamed(logId, "Gate-drive frequency")).id, value: 40, unit: "kHz", instrument: "", note: "", photos: [] });

  it("a private log is not found for another member or a visitor, and they cannot add readings to it", async () => {
    expect(await bench.getLogForViewer(otherMember, logId)).toBeNull();
    expect(await bench.getLogForViewer(null, logId)).toBeNull();
    await expect(attempt(otherMember)).rejects.toMatchObject({ status: 404 });
    await expect(bench.setVisibility(otherMember, logId, "public")).rejects.toMatchObject({ status: 404 });
    await expect(bench.addCheckpoint(otherMember, logId, { stage: "low-current", name: "Sneaky", measure: "x", unit: "V", expectedMin: 0, expectedMax: 1 })).rejects.toMatchObject({ status: 404 });
    expect(await count("readings where log_id = $1", [logId])).toBe(0);
    expect(await count("log_checkpoints where log_id = $1 and added_by_builder", [logId])).toBe(0);
    // An id that is not even a uuid is simply not found.
    expect(await bench.getLogForViewer(builder, "not-a-log")).toBeNull();
  });

  it("a moderator reads a private log, read-only", async () => {
    expect(await bench.getLogForViewer(moderator, logId)).toMatchObject({ access: "moderator", canEdit: false });
    await expect(attempt(moderator)).rejects.toMatchObject({ status: 403 });
  });

  it("a reviewer reads it once their session is accepted; one without a session does not", async () => {
    const session = randomUUID();
    await pool.query(
      "insert into review_sessions (id, log_id, builder_id, reviewer_id, stages, state, price_minor, currency, fee_bps, fee_minor, reviewer_share_minor, respond_by) values ($1, $2, $3, $4, $5, 'requested', 4000, 'EUR', 800, 320, 3680, now() + interval '48 hours')",
      [session, logId, builder.id, reviewer.id, JSON.stringify(["series-lamp"])],
    );
    expect(await bench.getLogForViewer(reviewer, logId)).toBeNull();
    await pool.query("update review_sessions set state = 'accepted', accepted_at = now() where id = $1", [session]);
    const view = await bench.getLogForViewer(reviewer, logId);
    expect(view).toMatchObject({ access: "reviewer", canEdit: false, owner: { id: builder.id } });
    expect(view?.checkpoints).toHaveLength(9);
    await expect(attempt(reviewer)).rejects.toMatchObject({ status: 403 });
    // Another member holding the reviewer role, with no session on this log.
    expect(await bench.getLogForViewer({ id: "demo-seller-kits", roles: ["seller", "reviewer"] }, logId)).toBeNull();
  });

  it("a public log is readable by anyone, still changed only by its owner, and can be made private again", async () => {
    await bench.setVisibility(builder, logId, "public");
    expect(await bench.getLogForViewer(null, logId)).toMatchObject({ access: "public", canEdit: false, visibility: "public" });
    expect(await bench.getLogForViewer(otherMember, logId)).toMatchObject({ access: "public", canEdit: false });
    await expect(attempt(otherMember)).rejects.toMatchObject({ status: 403 });
    expect(await count("readings where log_id = $1", [logId])).toBe(0);
    await bench.setVisibility(builder, logId, "private");
    expect(await bench.getLogForViewer(null, logId)).toBeNull();
  });
});
