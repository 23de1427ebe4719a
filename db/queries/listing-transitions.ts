import "server-only";
import { asc, count, eq, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import {
  auditLog,
  listingCheckpoints,
  listingDecisions,
  listingPhotos,
  listingRequirements,
  listings,
  listingVersions,
  sellerProfiles,
  users,
  type Listing,
  type ListingState,
  type TopicReason,
} from "@/db/schema";
import { checkSafetySheet, topicLabel, type SafetySheetCheck } from "@/lib/policy";
import { planTransition, type ListingAction, type TransitionActor } from "@/lib/listings/transitions";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import { env } from "@/lib/env";
import { listingApprovedMail } from "@/emails/listings/listing-approved";
import { listingHeldMail } from "@/emails/listings/listing-held";
import { listingRestoredMail } from "@/emails/listings/listing-restored";
import { listingSentBackMail } from "@/emails/listings/listing-sent-back";
import { currentPolicyRevision } from "./policy";

export class TransitionError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422,
    message: string,
    readonly check?: SafetySheetCheck,
  ) {
    super(message);
    this.name = "TransitionError";
  }
}

export type TransitionInput = {
  listingId: string;
  action: ListingAction;
  actor: TransitionActor;
  reasons?: TopicReason[];
  note?: string;
};

const MAILS = {
  approved: listingApprovedMail,
  sent_back: listingSentBackMail,
  held: listingHeldMail,
  grace_expired: listingHeldMail,
  restored: listingRestoredMail,
} as const;

/**
 * Moves a listing through its life cycle: the row is locked, the rules checked, and the new state,
 * the decision, the audit entry and the seller's e-mail are written in one transaction.
 */
export async function transitionListing(input: TransitionInput): Promise<{ from: ListingState; to: ListingState }> {
  const { result, mailIds } = await db.transaction((tx) => transitionListingInTx(tx, input));
  await dispatchMail(mailIds);
  return result;
}

/**
 * The same inside a caller's transaction (an edit and the resubmission it causes commit together);
 * the caller dispatches `mailIds` after its commit.
 */
export async function transitionListingInTx(
  tx: Tx,
  input: TransitionInput,
): Promise<{ result: { from: ListingState; to: ListingState }; mailIds: string[] }> {
  const [listing] = await tx.select().from(listings).where(eq(listings.id, input.listingId)).for("update");
  if (!listing) throw new TransitionError(404, "No such listing.");
  const plan = planTransition({ listing, action: input.action, actor: input.actor, reasons: input.reasons, note: input.note });
  if (!plan.ok) throw new TransitionError(plan.status, plan.message);

  const revision = await currentPolicyRevision(tx);
  const check = checkSafetySheet({ declaration: listing.declaration, notes: listing.safetyNotes, revision });
  const goesLiveOrToReview = plan.to === "in_review" || plan.to === "live";
  if (goesLiveOrToReview && check.status !== "clear") {
    const why =
      check.status === "blocked"
        ? "The safety check blocks this listing: it cannot be sold as declared."
        : "The safety sheet is not complete for the current policy.";
    throw new TransitionError(409, `${why} ${check.findings.map((f) => f.message).join(" ")}`.trim(), check);
  }
  if (plan.to === "in_review") await assertReadyForReview(tx, listing);

  const now = new Date();
  const actorId = input.actor.kind === "user" ? input.actor.id : null;
  const message = input.reasons?.length
    ? input.reasons.map((r) => `${reasonLabel(r.topic)}: ${r.text}`).join("\n")
    : (input.note ?? null);
  await tx
    .update(listings)
    .set({
      state: plan.to,
      updatedAt: now,
      policyRevision: revision.revision,
      policyStatus: check.status,
      ...(plan.to === "in_review" ? { submittedAt: now } : {}),
      ...(plan.to === "live" ? { liveAt: now, graceUntil: null } : {}),
      ...(["sent_back", "held"].includes(plan.to) || plan.decision === "approved" || plan.decision === "restored" ? { moderatorMessage: message } : {}),
    })
    .where(eq(listings.id, listing.id));

  await tx.insert(listingDecisions).values({
    listingId: listing.id,
    actorId,
    decision: plan.decision,
    reasons: input.reasons ?? [],
    note: input.note ?? null,
    policyRevision: revision.revision,
  });
  await tx.insert(auditLog).values({
    actorId,
    action: `listing.${plan.decision}`,
    subjectType: "listing",
    subjectId: listing.id,
    reason: message,
    details: { from: plan.from, to: plan.to, policyRevision: revision.revision, policyStatus: check.status, reasons: input.reasons ?? [] },
  });
  if (plan.decision === "approved") {
    await tx.insert(listingVersions).values({ listingId: listing.id, snapshot: await snapshotListing(tx, listing), approvedBy: actorId });
  }

  const mailIds: string[] = [];
  const mail = MAILS[plan.decision as keyof typeof MAILS];
  if (mail) {
    const [seller] = await tx.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, listing.sellerId));
    if (seller?.email) {
      mailIds.push(
        await enqueueMail(tx, {
          template: mail,
          to: seller.email,
          props: {
            sellerName: seller.name ?? seller.email,
            listingTitle: listing.title,
            listingUrl: `${env().APP_URL}/sell/listings/${listing.id}`,
            reasons: (input.reasons ?? []).map((r) => ({ topicLabel: reasonLabel(r.topic), text: r.text })),
            note: input.note ?? null,
          },
        }),
      );
    }
  }
  return { result: { from: plan.from, to: plan.to }, mailIds };
}

async function assertReadyForReview(tx: Tx, listing: Listing): Promise<void> {
  const [photos] = await tx.select({ n: count() }).from(listingPhotos).where(eq(listingPhotos.listingId, listing.id));
  if (!photos || photos.n < 1) throw new TransitionError(409, "Add at least one photo before submitting the listing.");
  const [profile] = await tx
    .select({ charges: sellerProfiles.chargesEnabled, payouts: sellerProfiles.payoutsEnabled })
    .from(sellerProfiles)
    .where(eq(sellerProfiles.userId, listing.sellerId));
  if (!profile?.charges || !profile.payouts) {
    throw new TransitionError(409, "Connect and finish your payout account before submitting; until then you can keep drafting.");
  }
}

/** What a moderator approved, for the diff shown when the listing comes back to review. */
export async function snapshotListing(tx: Tx, listing: Listing): Promise<Record<string, unknown>> {
  const [checkpoints, requirements] = await Promise.all([
    tx
      .select({
        stage: listingCheckpoints.stage,
        name: listingCheckpoints.name,
        measure: listingCheckpoints.measure,
        unit: listingCheckpoints.unit,
        expectedMin: listingCheckpoints.expectedMin,
        expectedMax: listingCheckpoints.expectedMax,
      })
      .from(listingCheckpoints)
      .where(eq(listingCheckpoints.listingId, listing.id))
      .orderBy(asc(listingCheckpoints.position)),
    tx
      .select({ subtype: listingRequirements.subtype, label: listingRequirements.label, minInductanceH: listingRequirements.minInductanceH, atCurrentA: listingRequirements.atCurrentA })
      .from(listingRequirements)
      .where(eq(listingRequirements.listingId, listing.id)),
  ]);
  return {
    title: listing.title,
    kind: listing.kind,
    magneticSubtype: listing.magneticSubtype,
    descriptionMd: listing.descriptionMd,
    figures: listing.figures,
    declaration: listing.declaration,
    safetyNotes: listing.safetyNotes,
    checkpoints,
    requirements,
  };
}

/** Editing the safety sheet or figures of a live listing bumps the sheet revision and sends it back to review. */
export async function bumpSheetRevision(tx: Tx, listingId: string): Promise<void> {
  await tx.update(listings).set({ sheetRevision: sql`${listings.sheetRevision} + 1` }).where(eq(listings.id, listingId));
}

/** A send-back reason names a safety topic, or "general" for what is not part of the sheet. */
function reasonLabel(topic: string): string {
  return topicLabel(topic as never) ?? (topic === "general" ? "General" : topic);
}
