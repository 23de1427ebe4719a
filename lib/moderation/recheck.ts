import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, listingDecisions, listings, policyRecheckResults, policyRevisions, users } from "@/db/schema";
import { currentPolicyRevision } from "@/db/queries/policy";
import { listingsPastGrace, openRecheckResults } from "@/db/queries/moderation";
import { transitionListing, TransitionError } from "@/db/queries/listing-transitions";
import { env } from "@/lib/env";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import { checkSafetySheet, topicLabel, type PolicyRevision, type SafetyFinding } from "@/lib/policy";
import { graceDate, policyGraceNoticeMail } from "@/emails/moderation/policy-grace-notice";

// What happens after an admin publishes a policy revision: every live listing is checked against it;
// those that fail get a notice and a grace period, and when the grace runs out they are held.
// Both jobs are safe to run twice: pg-boss retries a job that failed half-way.

const DAY_MS = 24 * 60 * 60 * 1000;

export type RecheckSummary = { revision: number; checked: number; clear: number; failing: number; skipped: number };

function findingsText(findings: SafetyFinding[]): string {
  return findings.map((f) => `${topicLabel(f.topic)}: ${f.message}`).join("\n");
}

/** Checks every live listing against `revision` and records the outcome, one transaction per listing. */
export async function recheckLiveListings(revision: number, now: Date = new Date()): Promise<RecheckSummary> {
  const [published] = await db
    .select({ rules: policyRevisions.rules, graceDays: policyRevisions.graceDays, summary: policyRevisions.summary })
    .from(policyRevisions)
    .where(eq(policyRevisions.revision, revision));
  if (!published) throw new Error(`policy revision ${revision} is not published`);
  const graceUntil = new Date(now.getTime() + published.graceDays * DAY_MS);

  const live = await db.select({ id: listings.id }).from(listings).where(eq(listings.state, "live"));
  const summary: RecheckSummary = { revision, checked: 0, clear: 0, failing: 0, skipped: 0 };
  for (const { id } of live) {
    const outcome = await recheckOne(id, published.rules, published.summary, graceUntil, now);
    summary[outcome] += 1;
    if (outcome !== "skipped") summary.checked += 1;
  }
  return summary;
}

async function recheckOne(
  listingId: string,
  rules: PolicyRevision,
  revisionSummary: string,
  graceUntil: Date,
  now: Date,
): Promise<"clear" | "failing" | "skipped"> {
  const { outcome, mailIds } = await db.transaction(async (tx) => {
    const [listing] = await tx.select().from(listings).where(eq(listings.id, listingId)).for("update");
    // Gone out of the catalog since the list was read, or already checked by an earlier attempt.
    if (!listing || listing.state !== "live") return { outcome: "skipped" as const, mailIds: [] };
    const [done] = await tx
      .select({ id: policyRecheckResults.id })
      .from(policyRecheckResults)
      .where(and(eq(policyRecheckResults.revision, rules.revision), eq(policyRecheckResults.listingId, listingId)));
    if (done) return { outcome: "skipped" as const, mailIds: [] };

    const check = checkSafetySheet({ declaration: listing.declaration, notes: listing.safetyNotes, revision: rules });
    if (check.status === "clear") {
      await tx.insert(policyRecheckResults).values({ revision: rules.revision, listingId, status: "clear", findings: [], checkedAt: now });
      await tx.update(listings).set({ policyRevision: rules.revision, policyStatus: "clear" }).where(eq(listings.id, listingId));
      return { outcome: "clear" as const, mailIds: [] };
    }

    // A grace period already running (from an earlier revision) is not extended by a newer one.
    const until = listing.graceUntil && listing.graceUntil < graceUntil ? listing.graceUntil : graceUntil;
    const note = `Policy revision ${rules.revision}: the safety sheet no longer meets it. The listing stays live until ${graceDate(until.toISOString())}; after that it is held unless the sheet is fixed.`;
    await tx.insert(policyRecheckResults).values({
      revision: rules.revision,
      listingId,
      status: check.status,
      findings: check.findings,
      graceUntil: until,
      noticeSentAt: now,
      checkedAt: now,
    });
    await tx.update(listings).set({ policyRevision: rules.revision, policyStatus: check.status, graceUntil: until }).where(eq(listings.id, listingId));
    const reasons = check.findings.map((f) => ({ topic: f.topic, text: f.message }));
    await tx.insert(listingDecisions).values({ listingId, actorId: null, decision: "grace_notice", reasons, note, policyRevision: rules.revision, createdAt: now });
    await tx.insert(auditLog).values({
      actorId: null,
      action: "listing.grace_notice",
      subjectType: "listing",
      subjectId: listingId,
      reason: `${note}\n${findingsText(check.findings)}`,
      details: { policyRevision: rules.revision, policyStatus: check.status, graceUntil: until.toISOString(), findings: check.findings.map((f) => `${f.topic}:${f.code}`) },
    });

    const mailIds: string[] = [];
    const [seller] = await tx.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, listing.sellerId));
    if (seller?.email) {
      mailIds.push(
        await enqueueMail(tx, {
          template: policyGraceNoticeMail,
          to: seller.email,
          props: {
            sellerName: seller.name ?? seller.email,
            listingTitle: listing.title,
            listingUrl: `${env().APP_URL}/sell/listings/${listing.id}`,
            revision: rules.revision,
            revisionSummary,
            graceUntil: until.toISOString(),
            findings: check.findings.map((f) => ({ topicLabel: topicLabel(f.topic), message: f.message })),
          },
        }),
      );
    }
    return { outcome: "failing" as const, mailIds };
  });
  await dispatchMail(mailIds);
  return outcome;
}

export type EnforcementSummary = { held: string[]; cleared: string[]; skipped: string[] };

/**
 * Holds the live listings whose grace period ran out and that still fail the policy in force.
 * Each is re-checked first: a seller who fixed the sheet in time is not held, and the grace is cleared.
 */
export async function enforceGracePeriods(now: Date = new Date()): Promise<EnforcementSummary> {
  const summary: EnforcementSummary = { held: [], cleared: [], skipped: [] };
  const revision = await currentPolicyRevision();
  for (const { id } of await listingsPastGrace(now)) {
    const [listing] = await db.select().from(listings).where(eq(listings.id, id));
    if (!listing || listing.state !== "live") {
      summary.skipped.push(id);
      continue;
    }
    const check = checkSafetySheet({ declaration: listing.declaration, notes: listing.safetyNotes, revision });
    if (check.status === "clear") {
      await db.transaction(async (tx) => {
        await tx.update(listings).set({ graceUntil: null, policyRevision: revision.revision, policyStatus: "clear" }).where(eq(listings.id, id));
        await tx.update(policyRecheckResults).set({ resolvedAt: now }).where(openRecheckResults(id));
      });
      summary.cleared.push(id);
      continue;
    }
    const note = `The grace period for policy revision ${revision.revision} ended on ${graceDate(listing.graceUntil!.toISOString())} and the safety sheet still does not meet it.\n${findingsText(check.findings)}`;
    try {
      await transitionListing({ listingId: id, action: "expire_grace", actor: { kind: "system" }, note });
    } catch (error) {
      // Taken out of the catalog by someone else in the meantime; nothing left to do.
      if (error instanceof TransitionError && error.status === 409) {
        summary.skipped.push(id);
        continue;
      }
      throw error;
    }
    await db.update(policyRecheckResults).set({ heldAt: now }).where(openRecheckResults(id));
    summary.held.push(id);
  }
  return summary;
}
