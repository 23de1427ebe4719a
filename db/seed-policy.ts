// The demo's policy history: revision 1 is built in; an admin published revision 2 two months ago (its
// grace period has run out, and one listing was held for it) and revision 3 two days ago (its grace
// period is running, and one live listing must be fixed before it ends).
import { and, eq, inArray } from "drizzle-orm";
import { checkSafetySheet, CURRENT_POLICY_REVISION, topicLabel, type PolicyRevision, type SafetyFinding } from "@/lib/policy";
import { policyRevisionSchema } from "@/lib/validations/policy";
import * as schema from "./schema";
import { DEMO_LISTINGS } from "./seed-listings";
import { DEMO_STORY_LISTINGS } from "./seed-listing-states";
import { seedAudit, type DemoClock, type SeedTx } from "./seed-support";

const ADMIN = "demo-admin";
export const GRACE_DAYS = 14;
const DAY_MS = 24 * 60 * 60 * 1000;

export type DemoRevision = { rules: PolicyRevision; summary: string; publishedAt: Date; graceDays: number };

function withTopicMinimum(rules: PolicyRevision, topic: PolicyRevision["topicRules"][number]["topic"], minWords: number): PolicyRevision["topicRules"] {
  return rules.topicRules.map((r) => (r.topic === topic ? { ...r, minWords } : r));
}

/** Revisions 2 and 3, each the one before with one topic made stricter (as the admin's form builds them). */
export function demoRevisions(clock: DemoClock): [DemoRevision, DemoRevision] {
  const base = CURRENT_POLICY_REVISION;
  const twoAt = clock.ago(60);
  const twoSummary = "An output-voltage note must say how the open-circuit voltage is kept within the limit: at least 20 words.";
  const two: PolicyRevision = {
    ...base,
    revision: base.revision + 1,
    publishedAt: twoAt.toISOString(),
    summary: twoSummary,
    topicRules: withTopicMinimum(base, "output-voltage", 20),
  };
  const threeAt = clock.ago(2);
  const threeSummary = "An arc, fume and fire note must name the eye and skin protection, the ventilation and the fire watch: at least 20 words.";
  const three: PolicyRevision = {
    ...two,
    revision: two.revision + 1,
    publishedAt: threeAt.toISOString(),
    summary: threeSummary,
    topicRules: withTopicMinimum(two, "arc-hazards", 20),
  };
  return [
    { rules: policyRevisionSchema.parse(two), summary: twoSummary, publishedAt: twoAt, graceDays: GRACE_DAYS },
    { rules: policyRevisionSchema.parse(three), summary: threeSummary, publishedAt: threeAt, graceDays: GRACE_DAYS },
  ];
}

export function revisionRules(clock: DemoClock, revision: number): PolicyRevision {
  if (revision === CURRENT_POLICY_REVISION.revision) return CURRENT_POLICY_REVISION;
  const found = demoRevisions(clock).find((r) => r.rules.revision === revision);
  if (!found) throw new Error(`the demo has no policy revision ${revision}`);
  return found.rules;
}

// The same words as lib/moderation/recheck.ts and the grace-notice e-mail write, so the demo reads like the product.
export function graceDate(at: Date): string {
  return at.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
}

export function findingsText(findings: SafetyFinding[]): string {
  return findings.map((f) => `${topicLabel(f.topic)}: ${f.message}`).join("\n");
}

export function graceNoticeNote(revision: number, until: Date): string {
  return `Policy revision ${revision}: the safety sheet no longer meets it. The listing stays live until ${graceDate(until)}; after that it is held unless the sheet is fixed.`;
}

export function graceExpiredNote(revision: number, until: Date, findings: SafetyFinding[]): string {
  return `The grace period for policy revision ${revision} ended on ${graceDate(until)} and the safety sheet still does not meet it.\n${findingsText(findings)}`;
}

export function graceUntilFor(publishedAt: Date, graceDays = GRACE_DAYS): Date {
  return new Date(publishedAt.getTime() + graceDays * DAY_MS);
}

type Sheet = { id: string; declaration: schema.Listing["declaration"]; notes: schema.Listing["safetyNotes"] };

/** Which listings were live when each revision's re-check ran; the story listings say when they were. */
function liveAt(clock: DemoClock, revision: DemoRevision): Sheet[] {
  const base = DEMO_LISTINGS.filter((l) => l.state === "live").map((l) => ({ id: l.id, declaration: l.declaration, notes: l.notes }));
  const stories = DEMO_STORY_LISTINGS.filter((l) => {
    let live = false;
    for (const step of l.story(clock)) {
      if (step.at > revision.publishedAt) break;
      if (step.decision === "approved" || step.decision === "restored") live = true;
      if (["held", "grace_expired", "retired", "sent_back"].includes(step.decision)) live = false;
    }
    return live;
  }).map((l) => ({ id: l.id, declaration: l.declaration, notes: l.notes }));
  return [...base, ...stories];
}

/**
 * Publishes revisions 2 and 3 with their audit entries and re-check results, once. The first time,
 * the demo's base listings that are live are brought to revision 3 as its re-check left them.
 */
export async function seedPolicy(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const revision of demoRevisions(clock)) {
    const rows = await tx
      .insert(schema.policyRevisions)
      .values({ revision: revision.rules.revision, rules: revision.rules, summary: revision.summary, graceDays: revision.graceDays, publishedBy: ADMIN, publishedAt: revision.publishedAt })
      .onConflictDoNothing()
      .returning({ revision: schema.policyRevisions.revision });
    if (rows.length === 0) continue;
    inserted += 1;
    const previous = revision.rules.revision - 1;
    await seedAudit(tx, [
      {
        at: revision.publishedAt,
        actorId: ADMIN,
        action: "policy.published",
        subjectType: "policy_revision",
        subjectId: String(revision.rules.revision),
        reason: revision.summary,
        details: {
          previous,
          minWords: revision.rules.minWords,
          safeVoltageV: revision.rules.safeVoltageV,
          storedChargeThresholdC: revision.rules.storedChargeThresholdC,
          waitMarginFactor: revision.rules.waitMarginFactor,
          topicMinWords: Object.fromEntries(revision.rules.topicRules.filter((r) => r.minWords !== undefined).map((r) => [r.topic, r.minWords])),
          graceDays: revision.graceDays,
        },
      },
    ]);
    const until = graceUntilFor(revision.publishedAt, revision.graceDays);
    const heldAfter = DEMO_STORY_LISTINGS.find((l) => l.story(clock).some((s) => s.decision === "grace_expired" && s.policyRevision === revision.rules.revision));
    // The worker's re-check ran as the revision was published; the story listings' notices carry the same moment.
    const checkedAt = revision.publishedAt;
    for (const sheet of liveAt(clock, revision)) {
      const check = checkSafetySheet({ declaration: sheet.declaration, notes: sheet.notes, revision: revision.rules });
      const failing = check.status !== "clear";
      await tx.insert(schema.policyRecheckResults).values({
        revision: revision.rules.revision,
        listingId: sheet.id,
        status: check.status,
        findings: check.findings,
        graceUntil: failing ? until : null,
        noticeSentAt: failing ? checkedAt : null,
        heldAt: failing && heldAfter?.id === sheet.id ? until : null,
        checkedAt,
      });
    }
  }
  // Revision 3 is the one in force: the base listings that were live when it was published carry its
  // outcome (the story listings were written with theirs). Only rows still at revision 1 are touched,
  // so a listing the seller or a moderator has changed in the demo since is left as it is.
  const third = demoRevisions(clock)[1];
  if (inserted > 0) {
    const baseLive = DEMO_LISTINGS.filter((l) => l.state === "live");
    for (const l of baseLive) {
      const check = checkSafetySheet({ declaration: l.declaration, notes: l.notes, revision: third.rules });
      if (check.status !== "clear") throw new Error(`demo listing ${l.slug} must stay clear under the demo's revision ${third.rules.revision}`);
    }
    await tx
      .update(schema.listings)
      .set({ policyRevision: third.rules.revision, policyStatus: "clear" })
      .where(and(inArray(schema.listings.id, baseLive.map((l) => l.id)), eq(schema.listings.policyRevision, CURRENT_POLICY_REVISION.revision), eq(schema.listings.state, "live")));
  }
  return inserted;
}
