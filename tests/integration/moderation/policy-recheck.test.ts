import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertListing, sheetNotes } from "./fixtures";
import { auditFor, outboxTo, sessionUser, setupModerationDb, type ModerationTestDb } from "./setup";

// An admin publishes a stricter revision (40 words per note instead of 12); the re-check job gives
// failing live listings a notice and a grace period, and the enforcement job holds them after it.
let t: ModerationTestDb;
const DAY = 24 * 60 * 60 * 1000;
const BRAM = "bram.kits@larkspur.test";
let published: Date;
// The demo seed has live listings of its own; they are re-checked too, so counts are taken relative to them.
let liveCount: number;
const ids = {} as Record<"short" | "long" | "fixedLive" | "fixedReview" | "review", string>;

const STRICTER = {
  summary: "Notes must now be at least 40 words, so each one says enough to act on.",
  minWords: "40",
  topicMinWords: {},
  safeVoltageV: "60",
  storedChargeThresholdMicroC: "45",
  waitMarginFactor: "1",
  graceDays: "14",
};

beforeAll(async () => {
  t = await setupModerationDb("moderation_recheck");
  ids.short = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Short sheet kit", state: "live" });
  ids.long = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Long sheet kit", state: "live", notes: sheetNotes({ long: true }) });
  ids.fixedLive = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Fixed in place kit", state: "live" });
  ids.fixedReview = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Fixed and resubmitted kit", state: "live" });
  ids.review = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Waiting kit", state: "in_review" });
  const { rows } = await t.pool.query("select count(*)::int as n from listings where state = 'live'");
  liveCount = rows[0].n;
});

const mine = () => Object.values(ids);
const MY_TITLES = ["Short sheet kit", "Long sheet kit", "Fixed in place kit", "Fixed and resubmitted kit", "Waiting kit"];
afterAll(async () => {
  await t.teardown();
});

describe("publishing a policy revision", () => {
  it("is for admins only", async () => {
    const { publishPolicyRevision } = await import("@/lib/moderation/publish-policy");
    expect(await publishPolicyRevision(await sessionUser("demo-moderator"), STRICTER)).toMatchObject({ ok: false, status: 403 });
    const { rows } = await t.pool.query("select count(*)::int as n from policy_revisions");
    expect(rows[0].n).toBe(0);
  });

  it("refuses figures out of range, naming the field", async () => {
    const { publishPolicyRevision } = await import("@/lib/moderation/publish-policy");
    const outcome = await publishPolicyRevision(await sessionUser("demo-admin"), { ...STRICTER, minWords: "0", waitMarginFactor: "0.5", graceDays: "" });
    expect(outcome).toMatchObject({ ok: false, status: 422 });
    expect(Object.keys(outcome.ok ? {} : outcome.fieldErrors).sort()).toEqual(["graceDays", "minWords", "waitMarginFactor"]);
  });

  it("stores revision 2 from the current rules with the admin's figures, and writes policy.published", async () => {
    const { publishPolicyRevision } = await import("@/lib/moderation/publish-policy");
    const { currentPolicyRevision } = await import("@/db/queries/policy");
    published = new Date();
    expect(await publishPolicyRevision(await sessionUser("demo-admin"), { ...STRICTER, topicMinWords: { "stored-charge": "45" } })).toEqual({ ok: true, revision: 2 });
    const rules = await currentPolicyRevision();
    expect(rules).toMatchObject({ revision: 2, minWords: 40, safeVoltageV: 60, waitMarginFactor: 1 });
    // 45 µC, the threshold PRODUCT.md names, typed in µC and stored in coulombs.
    expect(rules.storedChargeThresholdC).toBe(45e-6);
    expect(rules.topicRules.find((r) => r.topic === "stored-charge")?.minWords).toBe(45);
    expect(rules.topicRules.find((r) => r.topic === "mains-isolation")?.minWords).toBeUndefined();
    const audit = await auditFor(t.pool, "2");
    expect(audit).toMatchObject([{ actor_id: "demo-admin", action: "policy.published", details: { previous: 1, minWords: 40, graceDays: 14 } }]);
  });
});

describe("the re-check job", () => {
  it("is registered with the worker, and the grace enforcement runs every ten minutes", async () => {
    const { JOB_HANDLERS, SCHEDULES } = await import("@/lib/jobs/handlers");
    expect(typeof JOB_HANDLERS["policy-recheck"]).toBe("function");
    expect(typeof JOB_HANDLERS["policy-enforce-grace"]).toBe("function");
    expect(SCHEDULES).toContainEqual({ queue: "policy-enforce-grace", cron: "*/10 * * * *" });
  });

  it("marks short-noted live listings failing with a grace date and a notice, and the long-noted one clear", async () => {
    const { recheckLiveListings } = await import("@/lib/moderation/recheck");
    const before = (await outboxTo(t.pool, BRAM)).length;
    const summary = await recheckLiveListings(2, published);
    expect(summary).toMatchObject({ revision: 2, checked: liveCount, skipped: 0 });
    expect(summary.clear + summary.failing).toBe(liveCount);

    const { rows } = await t.pool.query("select listing_id, status, grace_until, notice_sent_at from policy_recheck_results where revision = 2");
    const byId = new Map(rows.map((r) => [r.listing_id, r]));
    expect(byId.get(ids.long)).toMatchObject({ status: "clear", grace_until: null });
    expect(byId.get(ids.short)?.status).toBe("incomplete");
    expect((byId.get(ids.short)?.grace_until as Date).getTime()).toBe(published.getTime() + 14 * DAY);
    expect(byId.has(ids.review)).toBe(false);

    const { rows: listings } = await t.pool.query("select id, grace_until, policy_revision, policy_status from listings where id = any($1)", [[ids.short, ids.long]]);
    expect(listings.find((l) => l.id === ids.long)).toMatchObject({ grace_until: null, policy_revision: 2, policy_status: "clear" });
    expect(listings.find((l) => l.id === ids.short)).toMatchObject({ policy_revision: 2, policy_status: "incomplete" });

    const { rows: decisions } = await t.pool.query("select decision, actor_id, reasons from listing_decisions where listing_id = $1", [ids.short]);
    expect(decisions).toHaveLength(1);
    expect(decisions[0]).toMatchObject({ decision: "grace_notice", actor_id: null });
    expect(decisions[0].reasons.map((r: { topic: string }) => r.topic)).toEqual(["mains-isolation", "stored-charge", "first-power-up", "protective-earth", "codes-and-competence"]);
    expect(await auditFor(t.pool, ids.short)).toMatchObject([{ actor_id: null, action: "listing.grace_notice" }]);

    const notices = (await outboxTo(t.pool, BRAM)).slice(before).filter((m) => m.template === "policy-grace-notice" && MY_TITLES.includes(String(m.props.listingTitle)));
    expect(notices.map((m) => m.props.listingTitle).sort()).toEqual(["Fixed and resubmitted kit", "Fixed in place kit", "Short sheet kit"]);
    const notice = notices.find((m) => m.props.listingTitle === "Short sheet kit");
    expect(notice).toMatchObject({ template: "policy-grace-notice", props: { revision: 2, graceUntil: new Date(published.getTime() + 14 * DAY).toISOString() } });
    const findings = notice!.props.findings as { topicLabel: string; message: string }[];
    expect(findings.find((f) => f.topicLabel === "Stored charge")?.message).toMatch(/asks for at least 45/);
    expect(findings.find((f) => f.topicLabel === "Mains isolation")?.message).toMatch(/asks for at least 40/);
  });

  it("running twice (a retried job) changes nothing", async () => {
    const { JOB_HANDLERS } = await import("@/lib/jobs/handlers");
    const { rows: before } = await t.pool.query("select count(*)::int as n from mail_outbox");
    expect(await JOB_HANDLERS["policy-recheck"]!({ revision: 2 })).toMatchObject({ checked: 0, skipped: liveCount });
    const { rows: after } = await t.pool.query("select count(*)::int as n from mail_outbox");
    expect(after[0].n).toBe(before[0].n);
    const { rows } = await t.pool.query("select count(*)::int as n from policy_recheck_results");
    expect(rows[0].n).toBe(liveCount);
  });

  it("the moderator's overview counts clear, failing and held, and lists the failing ones with their grace date", async () => {
    const { recheckOverview } = await import("@/db/queries/moderation");
    const [run] = await recheckOverview();
    expect(run).toMatchObject({ revision: 2, graceDays: 14, counts: { checked: liveCount, held: 0 } });
    expect(run!.counts.clear + run!.counts.failing).toBe(liveCount);
    const ours = run!.failing.filter((f) => mine().includes(f.listingId));
    expect(ours.map((f) => f.title).sort()).toEqual(["Fixed and resubmitted kit", "Fixed in place kit", "Short sheet kit"]);
    expect(ours.every((f) => f.graceUntil === new Date(published.getTime() + 14 * DAY).toISOString())).toBe(true);
    expect(run!.failing.some((f) => f.listingId === ids.long)).toBe(false);
  });
});

describe("enforcing grace periods", () => {
  it("holds nothing before the grace date", async () => {
    const { enforceGracePeriods } = await import("@/lib/moderation/recheck");
    const early = await enforceGracePeriods(new Date(published.getTime() + 13 * DAY));
    expect(early).toEqual({ held: [], cleared: [], skipped: [] });
    const { rows } = await t.pool.query("select state from listings where id = $1", [ids.short]);
    expect(rows[0].state).toBe("live");
  });

  it("after the grace date holds what still fails, and leaves alone what the seller fixed", async () => {
    const { transitionListing } = await import("@/db/queries/listing-transitions");
    const { enforceGracePeriods } = await import("@/lib/moderation/recheck");
    // One seller fixed the notes in place; another edited and sent the listing back to review.
    await t.pool.query("update listings set safety_notes = $2 where id = $1", [ids.fixedLive, JSON.stringify(sheetNotes({ long: true }))]);
    await t.pool.query("update listings set safety_notes = $2 where id = $1", [ids.fixedReview, JSON.stringify(sheetNotes({ long: true }))]);
    await transitionListing({ listingId: ids.fixedReview, action: "resubmit_after_edit", actor: { kind: "user", id: "demo-seller-kits", roles: ["member", "seller"] } });
    const before = (await outboxTo(t.pool, BRAM)).length;

    const later = new Date(published.getTime() + 15 * DAY);
    const summary = await enforceGracePeriods(later);
    expect(summary.held).toContain(ids.short);
    expect(summary.cleared).toEqual([ids.fixedLive]);
    for (const id of [ids.fixedLive, ids.fixedReview, ids.long]) expect(summary.held).not.toContain(id);

    const { rows } = await t.pool.query("select id, state, grace_until, moderator_message from listings where id = any($1)", [[ids.short, ids.fixedLive, ids.fixedReview, ids.long]]);
    const byId = new Map(rows.map((r) => [r.id, r]));
    expect(byId.get(ids.short)).toMatchObject({ state: "held" });
    expect(byId.get(ids.short)?.moderator_message).toMatch(/grace period for policy revision 2 ended/);
    expect(byId.get(ids.fixedLive)).toMatchObject({ state: "live", grace_until: null });
    expect(byId.get(ids.fixedReview)?.state).toBe("in_review");
    expect(byId.get(ids.long)?.state).toBe("live");

    expect((await auditFor(t.pool, ids.short)).map((a) => [a.actor_id, a.action])).toEqual([
      [null, "listing.grace_notice"],
      [null, "listing.grace_expired"],
    ]);
    const mails = (await outboxTo(t.pool, BRAM)).slice(before).filter((m) => MY_TITLES.includes(String(m.props.listingTitle)));
    expect(mails).toMatchObject([{ template: "listing-held", props: { listingTitle: "Short sheet kit" } }]);

    const { rows: results } = await t.pool.query("select listing_id, held_at, resolved_at from policy_recheck_results where revision = 2");
    const r = new Map(results.map((x) => [x.listing_id, x]));
    expect((r.get(ids.short)?.held_at as Date).getTime()).toBe(later.getTime());
    expect((r.get(ids.fixedLive)?.resolved_at as Date).getTime()).toBe(later.getTime());
    expect(r.get(ids.fixedLive)?.held_at).toBeNull();

    // The next run finds nothing left to do.
    expect(await enforceGracePeriods(new Date(later.getTime() + DAY))).toEqual({ held: [], cleared: [], skipped: [] });
  });

  it("a listing in review that fails the new revision cannot be approved until its sheet is fixed", async () => {
    const { moderateListing } = await import("@/lib/moderation/listing-actions");
    const moderator = await sessionUser("demo-moderator");
    expect(await moderateListing(moderator, ids.review, "approve", {})).toMatchObject({ ok: false, status: 409 });
    expect(await moderateListing(moderator, ids.fixedReview, "approve", {})).toMatchObject({ ok: true, to: "live" });
    const { rows } = await t.pool.query("select grace_until from listings where id = $1", [ids.fixedReview]);
    expect(rows[0].grace_until).toBeNull();
  });

  it("the overview then counts one held", async () => {
    const { recheckOverview } = await import("@/db/queries/moderation");
    const [run] = await recheckOverview();
    const { rows } = await t.pool.query("select count(*)::int as n from policy_recheck_results where revision = 2 and held_at is not null");
    expect(rows[0].n).toBeGreaterThanOrEqual(1);
    expect(run!.counts).toMatchObject({ checked: liveCount, held: rows[0].n, resolved: 1 });
    expect(run!.failing.find((f) => f.listingId === ids.short)).toMatchObject({ listingState: "held" });
  });
});
