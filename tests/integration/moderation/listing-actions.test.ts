import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertListing, sheetNotes } from "./fixtures";
import { auditFor, outboxTo, sessionUser, setupModerationDb, type ModerationTestDb } from "./setup";

// Every moderator action on a listing, through the function the server actions and the
// /api/moderation/listings/[id]/* routes share, against the real PostgreSQL.
let t: ModerationTestDb;
const BRAM = "bram.kits@larkspur.test";

beforeAll(async () => {
  t = await setupModerationDb("moderation_actions");
});
afterAll(async () => {
  await t.teardown();
});

async function state(id: string): Promise<{ state: string; moderator_message: string | null }> {
  const { rows } = await t.pool.query("select state, moderator_message from listings where id = $1", [id]);
  return rows[0];
}

async function decisions(id: string): Promise<string[]> {
  const { rows } = await t.pool.query("select decision from listing_decisions where listing_id = $1 order by created_at", [id]);
  return rows.map((r) => r.decision);
}

async function act(userId: string, listingId: string, action: "approve" | "send_back" | "hold" | "restore", body: unknown = {}) {
  const { moderateListing } = await import("@/lib/moderation/listing-actions");
  return moderateListing(await sessionUser(userId), listingId, action, body);
}

describe("approve", () => {
  it("a moderator makes an in-review listing live: decision, audit entry, approved snapshot and the seller's e-mail", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Gate drive board", state: "in_review" });
    const before = (await outboxTo(t.pool, BRAM)).length;
    expect(await act("demo-moderator", id, "approve", { note: "Sheet reads well." })).toEqual({ ok: true, from: "in_review", to: "live" });
    expect((await state(id)).state).toBe("live");
    expect(await decisions(id)).toEqual(["approved"]);
    expect(await auditFor(t.pool, id)).toMatchObject([{ actor_id: "demo-moderator", action: "listing.approved", details: { from: "in_review", to: "live" } }]);
    const { rows: versions } = await t.pool.query("select snapshot->>'title' as title, approved_by from listing_versions where listing_id = $1", [id]);
    expect(versions).toEqual([{ title: "Gate drive board", approved_by: "demo-moderator" }]);
    const mails = await outboxTo(t.pool, BRAM);
    expect(mails).toHaveLength(before + 1);
    expect(mails.at(-1)).toMatchObject({ template: "listing-approved", props: { listingTitle: "Gate drive board" } });
  });

  it("an admin may approve too (admin includes moderator)", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Snubber board", state: "in_review" });
    expect(await act("demo-admin", id, "approve")).toMatchObject({ ok: true, to: "live" });
  });
});

describe("send back", () => {
  it("needs at least one reason: 422 and nothing written", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Bridge board", state: "in_review" });
    expect(await act("demo-moderator", id, "send_back", { reasons: [] })).toMatchObject({ ok: false, status: 422 });
    expect(await act("demo-moderator", id, "send_back", {})).toMatchObject({ ok: false, status: 422 });
    // A reason of one letter is no reason.
    expect(await act("demo-moderator", id, "send_back", { reasons: [{ topic: "stored-charge", text: "x" }] })).toMatchObject({ ok: false, status: 422 });
    expect(await act("demo-moderator", id, "send_back", { reasons: [{ topic: "nonsense", text: "Fix it please." }] })).toMatchObject({
      ok: false,
      status: 422,
      fieldErrors: { "reasons.0.topic": expect.any(Array) },
    });
    expect((await state(id)).state).toBe("in_review");
    expect(await auditFor(t.pool, id)).toEqual([]);
  });

  it("records a reason per topic, including a general one, and e-mails them to the seller", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Output stage kit", state: "in_review" });
    const reasons = [
      { topic: "stored-charge", text: "Say how to confirm the bus is below 60 V." },
      { topic: "general", text: "The second photo is out of focus." },
    ];
    expect(await act("demo-moderator", id, "send_back", { reasons })).toEqual({ ok: true, from: "in_review", to: "sent_back" });
    const row = await state(id);
    expect(row.state).toBe("sent_back");
    expect(row.moderator_message).toMatch(/^Stored charge: Say how to confirm the bus is below 60 V\.\n[Gg]eneral: The second photo is out of focus\.$/);
    const { rows } = await t.pool.query("select reasons from listing_decisions where listing_id = $1", [id]);
    expect(rows[0].reasons).toEqual(reasons);
    expect(await auditFor(t.pool, id)).toMatchObject([{ actor_id: "demo-moderator", action: "listing.sent_back", details: { reasons } }]);
    expect((await outboxTo(t.pool, BRAM)).at(-1)).toMatchObject({
      template: "listing-sent-back",
      props: { listingTitle: "Output stage kit", reasons: [{ topicLabel: "Stored charge" }, { topicLabel: expect.stringMatching(/^[Gg]eneral$/) }] },
    });
  });

  it("refuses the same topic twice", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Twice board", state: "in_review" });
    const reasons = [
      { topic: "stored-charge", text: "One thing." },
      { topic: "stored-charge", text: "Another thing." },
    ];
    expect(await act("demo-moderator", id, "send_back", { reasons })).toMatchObject({ ok: false, status: 422 });
  });
});

describe("hold and restore", () => {
  it("holds a live listing with a reason and restores it; each writes an audit entry and e-mails the seller", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Bench supply board", state: "live" });
    expect(await act("demo-moderator", id, "hold", {})).toMatchObject({ ok: false, status: 422 });
    expect(await act("demo-moderator", id, "hold", { reason: "  " })).toMatchObject({ ok: false, status: 422 });
    expect(await act("demo-moderator", id, "hold", { reason: "A buyer reports the bleeder is not fitted on the board." })).toEqual({ ok: true, from: "live", to: "held" });
    expect(await state(id)).toEqual({ state: "held", moderator_message: "A buyer reports the bleeder is not fitted on the board." });
    expect(await act("demo-moderator", id, "restore", { note: "Seller sent photos of the fitted bleeder." })).toEqual({ ok: true, from: "held", to: "live" });
    expect(await decisions(id)).toEqual(["held", "restored"]);
    const audit = await auditFor(t.pool, id);
    expect(audit.map((a) => [a.actor_id, a.action])).toEqual([
      ["demo-moderator", "listing.held"],
      ["demo-moderator", "listing.restored"],
    ]);
    expect(audit[0]!.reason).toBe("A buyer reports the bleeder is not fitted on the board.");
    const templates = (await outboxTo(t.pool, BRAM)).slice(-2).map((m) => m.template);
    expect(templates).toEqual(["listing-held", "listing-restored"]);
  });
});

describe("guards", () => {
  it("a seller gets 403 for every moderator action, on someone else's listing or their own, and nothing changes", async () => {
    const own = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Own kit", state: "in_review" });
    const other = await insertListing(t.fx, { sellerId: "demo-seller-magnetics", title: "Other choke", state: "in_review", kind: "magnetic" });
    const live = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Own live kit", state: "live" });
    for (const id of [own, other]) {
      expect(await act("demo-seller-kits", id, "approve")).toMatchObject({ ok: false, status: 403 });
      expect(await act("demo-seller-kits", id, "send_back", { reasons: [{ topic: "general", text: "Looks fine to me." }] })).toMatchObject({ ok: false, status: 403 });
    }
    expect(await act("demo-seller-kits", live, "hold", { reason: "Hiding my own listing." })).toMatchObject({ ok: false, status: 403 });
    expect((await state(own)).state).toBe("in_review");
    expect((await state(other)).state).toBe("in_review");
    expect((await state(live)).state).toBe("live");
    expect([...(await auditFor(t.pool, own)), ...(await auditFor(t.pool, other)), ...(await auditFor(t.pool, live))]).toEqual([]);
  });

  it("a moderator who also sells cannot moderate their own listing (403), though another moderator can", async () => {
    await t.pool.query("insert into users (id, email, name) values ('mod-seller', 'wren.both@larkspur.test', 'Wren Both')");
    await t.pool.query("insert into user_roles (user_id, role) values ('mod-seller', 'moderator'), ('mod-seller', 'seller')");
    const id = await insertListing(t.fx, { sellerId: "mod-seller", title: "Wren's choke", state: "in_review", kind: "magnetic" });
    const refused = await act("mod-seller", id, "approve");
    expect(refused).toMatchObject({ ok: false, status: 403 });
    expect(refused.ok ? "" : refused.message).toMatch(/own listing/);
    expect(await act("demo-moderator", id, "approve")).toMatchObject({ ok: true });
    expect(await act("mod-seller", id, "hold", { reason: "Taking my own down." })).toMatchObject({ ok: false, status: 403 });
  });

  it("an action in the wrong state is a 409 conflict", async () => {
    const live = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Already live", state: "live" });
    const review = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Still in review", state: "in_review" });
    const draft = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Only a draft", state: "draft" });
    expect(await act("demo-moderator", live, "approve")).toMatchObject({ ok: false, status: 409 });
    expect(await act("demo-moderator", live, "send_back", { reasons: [{ topic: "general", text: "Too late for this." }] })).toMatchObject({ ok: false, status: 409 });
    expect(await act("demo-moderator", live, "restore")).toMatchObject({ ok: false, status: 409 });
    expect(await act("demo-moderator", review, "hold", { reason: "Not live yet." })).toMatchObject({ ok: false, status: 409 });
    expect(await act("demo-moderator", draft, "approve")).toMatchObject({ ok: false, status: 409 });
  });

  it("an unknown or malformed listing id is a 404", async () => {
    expect(await act("demo-moderator", "00000000-0000-4000-8000-000000000000", "approve")).toMatchObject({ ok: false, status: 404 });
    expect(await act("demo-moderator", "not-a-uuid", "approve")).toMatchObject({ ok: false, status: 404 });
  });

  it("approving a sheet that the policy in force no longer passes is a 409 naming what is missing", async () => {
    const id = await insertListing(t.fx, {
      sellerId: "demo-seller-kits",
      title: "Short-noted kit",
      state: "in_review",
      notes: sheetNotes().filter((n) => n.topic !== "protective-earth"),
    });
    const refused = await act("demo-moderator", id, "approve");
    expect(refused).toMatchObject({ ok: false, status: 409, findings: [{ topic: "protective-earth", code: "missing" }] });
    expect((await state(id)).state).toBe("in_review");
  });
});

describe("JSON answers", () => {
  it("maps outcomes to status codes and bodies", async () => {
    const { outcomeResponse } = await import("@/lib/moderation/listing-actions");
    const ok = outcomeResponse({ ok: true, from: "in_review", to: "live" });
    expect(ok.status).toBe(200);
    expect(await ok.json()).toEqual({ ok: true, from: "in_review", to: "live" });
    for (const [status, error] of [
      [403, "forbidden"],
      [404, "not_found"],
      [409, "conflict"],
      [422, "invalid_input"],
    ] as const) {
      const res = outcomeResponse({ ok: false, status, message: "m" });
      expect(res.status).toBe(status);
      expect(await res.json()).toEqual({ error, message: "m" });
    }
  });

  it("reads an empty body as {} and refuses broken JSON with 422", async () => {
    const { readOptionalJson } = await import("@/lib/http/json");
    expect(await readOptionalJson(new Request("http://x", { method: "POST", body: "" }))).toEqual({ ok: true, body: {} });
    const broken = await readOptionalJson(new Request("http://x", { method: "POST", body: "{reasons" }));
    expect(broken.ok ? 0 : broken.response.status).toBe(422);
  });
});

describe("review queue and diff", () => {
  it("lists in-review listings oldest first, marking re-submissions", async () => {
    const { reviewQueue } = await import("@/db/queries/moderation");
    const older = await insertListing(t.fx, { sellerId: "demo-seller-magnetics", title: "Queue: older", state: "in_review", minutesAgo: 600, kind: "magnetic" });
    const newer = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Queue: newer", state: "in_review", minutesAgo: 5 });
    const rows = (await reviewQueue()).filter((r) => r.title.startsWith("Queue:"));
    expect(rows.map((r) => r.id)).toEqual([older, newer]);
    expect(rows[0]).toMatchObject({ sellerName: "Kaszuba Windings", kind: "magnetic", resubmission: null });
    const all = await reviewQueue();
    const times = all.map((r) => r.submittedAt ?? "");
    expect([...times].sort()).toEqual(times);
  });

  it("a live listing edited by its seller comes back with the diff against the approved version", async () => {
    const { transitionListing } = await import("@/db/queries/listing-transitions");
    const { listingForReview, reviewQueue } = await import("@/db/queries/moderation");
    const { diffSnapshots } = await import("@/lib/moderation/diff");
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Diffed kit", state: "in_review" });
    await act("demo-moderator", id, "approve");
    // The seller's edit: a longer wait and a changed description, then back to review.
    const notes = sheetNotes({ waitSeconds: 180 });
    await t.pool.query("update listings set safety_notes = $2, description_md = $3 where id = $1", [id, JSON.stringify(notes), "A two-board kit.\n\nNow with a fitted bleeder."]);
    await transitionListing({ listingId: id, action: "resubmit_after_edit", actor: { kind: "user", id: "demo-seller-kits", roles: ["member", "seller"] } });

    expect((await reviewQueue()).find((r) => r.id === id)?.resubmission).toBe("after-approval");
    const review = await listingForReview(id);
    expect(review?.approved).not.toBeNull();
    const diff = diffSnapshots(review!.approved!.snapshot, review!.current);
    expect(diff.notes).toEqual([expect.objectContaining({ topic: "stored-charge", change: "changed", waitBefore: 120, waitAfter: 180 })]);
    expect(diff.description?.filter((l) => l.op !== "same").map((l) => `${l.op}:${l.text}`)).toEqual([
      "removed:The **power board** carries the bridge and the bus capacitors.",
      "added:Now with a fitted bleeder.",
    ]);
    expect(diff.title).toBeNull();
    expect(review?.decisions.map((d) => d.decision)).toEqual(["submitted", "approved"]);
  });
});

describe("audit log", () => {
  it("refuses to change or delete what the moderation wrote", async () => {
    const id = await insertListing(t.fx, { sellerId: "demo-seller-kits", title: "Audited kit", state: "in_review" });
    await act("demo-moderator", id, "approve");
    await expect(t.pool.query("update audit_log set reason = 'rewritten' where subject_id = $1", [id])).rejects.toThrow();
    await expect(t.pool.query("delete from audit_log where subject_id = $1", [id])).rejects.toThrow();
    expect(await auditFor(t.pool, id)).toHaveLength(1);
  });
});
