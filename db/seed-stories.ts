// Writes the story listings of seed-listing-states.ts: the row as its last decision left it, every
// decision with its audit entry (in the words the product uses), and the versions a moderator approved.
import { checkSafetySheet, topicLabel, type SafetyFinding } from "@/lib/policy";
import * as schema from "./schema";
import { DEMO_STORY_LISTINGS, type DemoStoryListing, type DemoStoryStep } from "./seed-listing-states";
import { demoRevisions, findingsText, graceExpiredNote, graceNoticeNote, graceUntilFor, revisionRules } from "./seed-policy";
import { demoUuid, seedAudit, type DemoClock, type SeedAudit, type SeedTx } from "./seed-support";

const STATE_AFTER: Partial<Record<schema.ListingDecisionKind, schema.ListingState>> = {
  submitted: "in_review",
  approved: "live",
  sent_back: "sent_back",
  held: "held",
  restored: "live",
  retired: "retired",
  grace_expired: "held",
};

type Written = {
  decision: typeof schema.listingDecisions.$inferInsert;
  audit: SeedAudit;
  message: string | null | undefined;
  to: schema.ListingState;
  graceUntil?: Date;
};

function publishedAtOf(clock: DemoClock, revision: number): Date {
  const found = demoRevisions(clock).find((r) => r.rules.revision === revision);
  if (!found) throw new Error(`a grace step names revision ${revision}, which the demo does not publish`);
  return found.publishedAt;
}

function findingsFor(listing: DemoStoryListing, clock: DemoClock, revision: number): { status: string; findings: SafetyFinding[] } {
  return checkSafetySheet({ declaration: listing.declaration, notes: listing.notes, revision: revisionRules(clock, revision) });
}

/** What one decision writes, and what it leaves on the listing (as listing-transitions.ts and recheck.ts do). */
function writeStep(listing: DemoStoryListing, clock: DemoClock, step: DemoStoryStep, from: schema.ListingState, n: number): Written {
  const { status, findings } = findingsFor(listing, clock, step.policyRevision);
  const id = demoUuid("listing-decision", n);
  if (step.decision === "grace_notice") {
    const until = graceUntilFor(publishedAtOf(clock, step.policyRevision));
    const note = graceNoticeNote(step.policyRevision, until);
    const reasons = findings.map((f) => ({ topic: f.topic, text: f.message }));
    return {
      decision: { id, listingId: listing.id, actorId: null, decision: "grace_notice", reasons, note, policyRevision: step.policyRevision, createdAt: step.at },
      audit: {
        at: step.at,
        actorId: null,
        action: "listing.grace_notice",
        subjectType: "listing",
        subjectId: listing.id,
        reason: `${note}\n${findingsText(findings)}`,
        details: { policyRevision: step.policyRevision, policyStatus: status, graceUntil: until.toISOString(), findings: findings.map((f) => `${f.topic}:${f.code}`) },
      },
      message: undefined,
      to: from,
      graceUntil: until,
    };
  }
  const to = STATE_AFTER[step.decision] ?? from;
  const note =
    step.decision === "grace_expired" ? graceExpiredNote(step.policyRevision, graceUntilFor(publishedAtOf(clock, step.policyRevision)), findings) : step.note;
  const message = step.reasons?.length ? step.reasons.map((r) => `${topicLabel(r.topic as Parameters<typeof topicLabel>[0])}: ${r.text}`).join("\n") : (note ?? null);
  const setsMessage = ["sent_back", "held"].includes(to) || step.decision === "approved" || step.decision === "restored";
  return {
    decision: { id, listingId: listing.id, actorId: step.actorId, decision: step.decision, reasons: step.reasons ?? [], note: note ?? null, policyRevision: step.policyRevision, createdAt: step.at },
    audit: {
      at: step.at,
      actorId: step.actorId,
      action: `listing.${step.decision}`,
      subjectType: "listing",
      subjectId: listing.id,
      reason: message,
      details: { from, to, policyRevision: step.policyRevision, policyStatus: status, reasons: step.reasons ?? [] },
    },
    message: setsMessage ? message : undefined,
    to,
  };
}

function snapshotOf(listing: DemoStoryListing): Record<string, unknown> {
  return {
    title: listing.title,
    kind: listing.kind,
    magneticSubtype: null,
    descriptionMd: listing.descriptionMd,
    figures: {},
    declaration: listing.declaration,
    safetyNotes: listing.notes,
    checkpoints: [],
    requirements: [],
  };
}

/** Inserts the story listings that are missing; returns how many it inserted. */
export async function seedStoryListings(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const [index, listing] of DEMO_STORY_LISTINGS.entries()) {
    const steps = listing.story(clock);
    let state: schema.ListingState = "draft";
    let moderatorMessage: string | null = null;
    let graceUntil: Date | null = null;
    const written: Written[] = [];
    for (const [i, step] of steps.entries()) {
      const w = writeStep(listing, clock, step, state, index * 100 + i);
      written.push(w);
      state = w.to;
      if (w.message !== undefined) moderatorMessage = w.message;
      if (w.graceUntil) graceUntil = w.graceUntil;
      // Going live again (a restore, an approval) ends any grace period, as the transition does.
      if (w.to === "live" && step.decision !== "grace_notice") graceUntil = null;
    }
    if (state !== listing.state) throw new Error(`the story of ${listing.slug} ends ${state}, not ${listing.state}`);
    const last = steps.at(-1)!;
    const current = findingsFor(listing, clock, last.policyRevision);
    const lastOf = (...kinds: schema.ListingDecisionKind[]) => [...steps].reverse().find((s) => kinds.includes(s.decision))?.at ?? null;

    const rows = await tx
      .insert(schema.listings)
      .values({
        id: listing.id,
        sellerId: listing.sellerId,
        kind: listing.kind,
        title: listing.title,
        slug: listing.slug,
        descriptionMd: listing.descriptionMd,
        priceMinor: listing.priceMinor,
        currency: "EUR",
        stock: listing.stock,
        shippingWeightG: listing.shippingWeightG,
        figures: {},
        declaration: listing.declaration,
        safetyNotes: listing.notes,
        state,
        policyRevision: last.policyRevision,
        policyStatus: current.status,
        moderatorMessage,
        graceUntil,
        submittedAt: lastOf("submitted"),
        liveAt: lastOf("approved", "restored"),
        createdAt: steps[0]!.at,
        updatedAt: last.at,
      })
      .onConflictDoNothing()
      .returning({ id: schema.listings.id });
    if (rows.length === 0) continue;
    inserted += 1;

    const key = `demo-story-${listing.photo}-${listing.id.slice(-4)}`;
    await tx.insert(schema.uploads).values({
      key,
      ownerId: listing.sellerId,
      purpose: "listing-photo",
      originalName: `${listing.photo}.webp`,
      contentType: "image/webp",
      bytes: 12_000,
      url: `/demo/${listing.photo}.webp`,
      thumbUrl: `/demo/${listing.photo}-thumb.webp`,
      width: 1200,
      height: 900,
      createdAt: steps[0]!.at,
    });
    await tx.insert(schema.listingPhotos).values({ id: demoUuid("listing-photo", index), listingId: listing.id, uploadKey: key, position: 0, alt: listing.title });
    await tx.insert(schema.listingDecisions).values(written.map((w) => w.decision));
    await seedAudit(tx, written.map((w) => w.audit));
    const approvals = steps.filter((s) => s.decision === "approved");
    if (approvals.length > 0) {
      await tx.insert(schema.listingVersions).values(
        approvals.map((s, i) => ({ id: demoUuid("listing-version", index * 10 + i), listingId: listing.id, snapshot: snapshotOf(listing), approvedBy: s.actorId, approvedAt: s.at })),
      );
    }
  }
  return inserted;
}
