import "server-only";
import { and, asc, count, desc, eq, inArray, isNotNull, isNull, ne, sql } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import {
  listingCheckpoints,
  listingDecisions,
  listingDocuments,
  listingPhotos,
  listingRequirements,
  listings,
  listingVersions,
  policyRecheckResults,
  policyRevisions,
  sellerApplications,
  sellerProfiles,
  uploads,
  users,
  type Listing,
  type ListingKind,
  type ListingState,
  type TopicReason,
} from "@/db/schema";
import { checkSafetySheet, type PolicyRevision, type SafetyDeclaration, type SafetyFinding, type SafetyNote, type SheetStatus } from "@/lib/policy";
import { snapshotListing } from "./listing-transitions";
import { currentPolicyRevision } from "./policy";

// What moderators read: the review queue, held listings, one listing in full, and re-check results.
// Writes go through db/queries/listing-transitions.ts and lib/moderation/.

/** Why a listing is back in the queue: edited after approval, or re-submitted after a send-back. */
export type Resubmission = "after-approval" | "after-send-back" | null;

export type QueueRow = {
  id: string;
  title: string;
  kind: ListingKind;
  magneticSubtype: string | null;
  sellerId: string;
  sellerName: string;
  submittedAt: string | null;
  /** against the revision in force now, not the one at submission */
  policyStatus: SheetStatus;
  policyRevision: number;
  resubmission: Resubmission;
};

const sellerName = sql<string>`coalesce(${sellerProfiles.shopName}, ${users.name}, ${users.email}, ${listings.sellerId})`;

function sheetStatus(declaration: SafetyDeclaration, notes: SafetyNote[], revision: PolicyRevision): SheetStatus {
  try {
    return checkSafetySheet({ declaration, notes, revision }).status;
  } catch {
    // A declaration the engineering core cannot compute with is not a complete sheet.
    return "incomplete";
  }
}

// Plain SQL so that importing this module never touches the database (the build imports it).
const hasApprovedVersion = sql<boolean>`exists (select 1 from ${listingVersions} where ${listingVersions.listingId} = ${listings.id})`;
const wasSentBack = sql<boolean>`exists (select 1 from ${listingDecisions} where ${listingDecisions.listingId} = ${listings.id} and ${listingDecisions.decision} = 'sent_back')`;

/** Listings waiting for a moderator, the longest-waiting first, each checked against the revision in force. */
export async function reviewQueue(executor: Executor = db): Promise<QueueRow[]> {
  const revision = await currentPolicyRevision(executor);
  const rows = await executor
    .select({
      id: listings.id,
      title: listings.title,
      kind: listings.kind,
      magneticSubtype: listings.magneticSubtype,
      sellerId: listings.sellerId,
      sellerName,
      submittedAt: listings.submittedAt,
      declaration: listings.declaration,
      safetyNotes: listings.safetyNotes,
      approvedBefore: hasApprovedVersion,
      sentBackBefore: wasSentBack,
    })
    .from(listings)
    .innerJoin(users, eq(users.id, listings.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(eq(listings.state, "in_review"))
    .orderBy(sql`${listings.submittedAt} asc nulls first`, asc(listings.createdAt));
  return rows.map(({ approvedBefore, sentBackBefore, submittedAt, declaration, safetyNotes, ...row }) => ({
    ...row,
    submittedAt: submittedAt?.toISOString() ?? null,
    policyStatus: sheetStatus(declaration, safetyNotes, revision),
    policyRevision: revision.revision,
    resubmission: approvedBefore ? "after-approval" : sentBackBefore ? "after-send-back" : null,
  }));
}

export type HeldRow = {
  id: string;
  title: string;
  kind: ListingKind;
  sellerName: string;
  reason: string | null;
  heldAt: string | null;
  bySystem: boolean;
};

export async function heldListings(executor: Executor = db): Promise<HeldRow[]> {
  const latestHold = executor
    .selectDistinctOn([listingDecisions.listingId], {
      listingId: listingDecisions.listingId,
      at: listingDecisions.createdAt,
      decision: listingDecisions.decision,
    })
    .from(listingDecisions)
    .where(inArray(listingDecisions.decision, ["held", "grace_expired"]))
    .orderBy(listingDecisions.listingId, desc(listingDecisions.createdAt))
    .as("latest_hold");
  const rows = await executor
    .select({
      id: listings.id,
      title: listings.title,
      kind: listings.kind,
      sellerName,
      reason: listings.moderatorMessage,
      heldAt: latestHold.at,
      decision: latestHold.decision,
    })
    .from(listings)
    .innerJoin(users, eq(users.id, listings.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .leftJoin(latestHold, eq(latestHold.listingId, listings.id))
    .where(eq(listings.state, "held"))
    .orderBy(sql`${latestHold.at} desc nulls last`);
  return rows.map(({ decision, heldAt, ...r }) => ({ ...r, heldAt: heldAt?.toISOString() ?? null, bySystem: decision === "grace_expired" }));
}

export type DecisionRow = {
  id: string;
  decision: string;
  actorName: string | null;
  reasons: TopicReason[];
  note: string | null;
  policyRevision: number | null;
  createdAt: Date;
};

export type ReviewPhoto = { position: number; alt: string; url: string; thumbUrl: string | null; width: number | null; height: number | null };
export type ReviewDocument = { kind: string; title: string; url: string; bytes: number };

export type ListingForReview = {
  listing: Listing;
  seller: { id: string; name: string | null; email: string | null; shopName: string | null };
  photos: ReviewPhoto[];
  documents: ReviewDocument[];
  checkpoints: (typeof listingCheckpoints.$inferSelect)[];
  requirements: (typeof listingRequirements.$inferSelect)[];
  decisions: DecisionRow[];
  /** The version a moderator last approved, and the same shape for the listing as it is now. */
  approved: { snapshot: Record<string, unknown>; approvedAt: Date; approvedBy: string | null } | null;
  current: Record<string, unknown>;
};

export async function listingForReview(listingId: string): Promise<ListingForReview | null> {
  const [listing] = await db.select().from(listings).where(eq(listings.id, listingId));
  if (!listing) return null;
  const [seller, photos, documents, checkpoints, requirements, decisions, [approved], current] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, email: users.email, shopName: sellerProfiles.shopName })
      .from(users)
      .leftJoin(sellerProfiles, eq(sellerProfiles.userId, users.id))
      .where(eq(users.id, listing.sellerId))
      .then((r) => r[0]!),
    db
      .select({ position: listingPhotos.position, alt: listingPhotos.alt, url: uploads.url, thumbUrl: uploads.thumbUrl, width: uploads.width, height: uploads.height })
      .from(listingPhotos)
      .innerJoin(uploads, eq(uploads.key, listingPhotos.uploadKey))
      .where(eq(listingPhotos.listingId, listing.id))
      .orderBy(asc(listingPhotos.position)),
    db
      .select({ kind: listingDocuments.kind, title: listingDocuments.title, url: uploads.url, bytes: uploads.bytes })
      .from(listingDocuments)
      .innerJoin(uploads, eq(uploads.key, listingDocuments.uploadKey))
      .where(eq(listingDocuments.listingId, listing.id))
      .orderBy(asc(listingDocuments.position)),
    db.select().from(listingCheckpoints).where(eq(listingCheckpoints.listingId, listing.id)).orderBy(asc(listingCheckpoints.position)),
    db.select().from(listingRequirements).where(eq(listingRequirements.listingId, listing.id)),
    db
      .select({
        id: listingDecisions.id,
        decision: listingDecisions.decision,
        actorName: sql<string | null>`coalesce(${users.name}, ${users.email})`,
        reasons: listingDecisions.reasons,
        note: listingDecisions.note,
        policyRevision: listingDecisions.policyRevision,
        createdAt: listingDecisions.createdAt,
      })
      .from(listingDecisions)
      .leftJoin(users, eq(users.id, listingDecisions.actorId))
      .where(eq(listingDecisions.listingId, listing.id))
      .orderBy(desc(listingDecisions.createdAt)),
    db
      .select({ snapshot: listingVersions.snapshot, approvedAt: listingVersions.approvedAt, approvedBy: sql<string | null>`coalesce(${users.name}, ${users.email})` })
      .from(listingVersions)
      .leftJoin(users, eq(users.id, listingVersions.approvedBy))
      .where(eq(listingVersions.listingId, listing.id))
      .orderBy(desc(listingVersions.approvedAt))
      .limit(1),
    // The same function that wrote the approved snapshot, so the diff compares like with like.
    db.transaction((tx) => snapshotListing(tx, listing)),
  ]);
  return { listing, seller, photos, documents, checkpoints, requirements, decisions, approved: approved ?? null, current };
}

export type RecheckFailing = {
  listingId: string;
  title: string;
  sellerName: string;
  status: string;
  findings: SafetyFinding[];
  graceUntil: string | null;
  heldAt: string | null;
  resolvedAt: string | null;
  listingState: ListingState;
};

export type RecheckRun = {
  revision: number;
  summary: string;
  publishedAt: string;
  graceDays: number;
  counts: { checked: number; clear: number; failing: number; held: number; resolved: number };
  failing: RecheckFailing[];
};

/** The newest re-check runs: per revision the counts, and every listing that did not pass with its grace date. */
export async function recheckOverview(limit = 3, executor: Executor = db): Promise<RecheckRun[]> {
  const revisions = await executor
    .select({ revision: policyRevisions.revision, summary: policyRevisions.summary, publishedAt: policyRevisions.publishedAt, graceDays: policyRevisions.graceDays })
    .from(policyRevisions)
    .orderBy(desc(policyRevisions.revision))
    .limit(limit);
  if (revisions.length === 0) return [];
  const numbers = revisions.map((r) => r.revision);
  const [counts, failing] = await Promise.all([
    executor
      .select({
        revision: policyRecheckResults.revision,
        checked: count(),
        clear: sql<number>`count(*) filter (where ${policyRecheckResults.status} = 'clear')::int`,
        held: sql<number>`count(*) filter (where ${policyRecheckResults.heldAt} is not null)::int`,
        resolved: sql<number>`count(*) filter (where ${policyRecheckResults.resolvedAt} is not null)::int`,
      })
      .from(policyRecheckResults)
      .where(inArray(policyRecheckResults.revision, numbers))
      .groupBy(policyRecheckResults.revision),
    executor
      .select({
        revision: policyRecheckResults.revision,
        listingId: policyRecheckResults.listingId,
        title: listings.title,
        sellerName,
        status: policyRecheckResults.status,
        findings: policyRecheckResults.findings,
        graceUntil: policyRecheckResults.graceUntil,
        heldAt: policyRecheckResults.heldAt,
        resolvedAt: policyRecheckResults.resolvedAt,
        listingState: listings.state,
      })
      .from(policyRecheckResults)
      .innerJoin(listings, eq(listings.id, policyRecheckResults.listingId))
      .innerJoin(users, eq(users.id, listings.sellerId))
      .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
      .where(and(inArray(policyRecheckResults.revision, numbers), ne(policyRecheckResults.status, "clear")))
      .orderBy(sql`${policyRecheckResults.graceUntil} asc nulls last`, asc(listings.title)),
  ]);
  return revisions.map((r) => {
    const c = counts.find((x) => x.revision === r.revision);
    const checked = Number(c?.checked ?? 0);
    const clear = Number(c?.clear ?? 0);
    return {
      revision: r.revision,
      summary: r.summary,
      publishedAt: r.publishedAt.toISOString(),
      graceDays: r.graceDays,
      counts: { checked, clear, failing: checked - clear, held: Number(c?.held ?? 0), resolved: Number(c?.resolved ?? 0) },
      failing: failing
        .filter((f) => f.revision === r.revision)
        .map(({ revision: _revision, graceUntil, heldAt, resolvedAt, ...f }) => ({
          ...f,
          graceUntil: graceUntil?.toISOString() ?? null,
          heldAt: heldAt?.toISOString() ?? null,
          resolvedAt: resolvedAt?.toISOString() ?? null,
        })),
    };
  });
}

/** Counts for the moderation desk's tabs. */
export async function moderationCounts(executor: Executor = db): Promise<{ inReview: number; held: number; applications: number; graceRunning: number }> {
  const [[inReview], [held], [applications], [graceRunning]] = await Promise.all([
    executor.select({ n: count() }).from(listings).where(eq(listings.state, "in_review")),
    executor.select({ n: count() }).from(listings).where(eq(listings.state, "held")),
    executor.select({ n: count() }).from(sellerApplications).where(eq(sellerApplications.status, "pending")),
    executor.select({ n: count() }).from(listings).where(and(eq(listings.state, "live"), isNotNull(listings.graceUntil))),
  ]);
  return { inReview: inReview?.n ?? 0, held: held?.n ?? 0, applications: applications?.n ?? 0, graceRunning: graceRunning?.n ?? 0 };
}

export type PublishedRevisionRow = {
  revision: number;
  summary: string;
  graceDays: number;
  publishedAt: Date;
  publishedBy: string | null;
  rules: typeof policyRevisions.$inferSelect.rules;
};

export async function publishedPolicyRevisions(executor: Executor = db): Promise<PublishedRevisionRow[]> {
  return executor
    .select({
      revision: policyRevisions.revision,
      summary: policyRevisions.summary,
      graceDays: policyRevisions.graceDays,
      publishedAt: policyRevisions.publishedAt,
      publishedBy: sql<string | null>`coalesce(${users.name}, ${users.email})`,
      rules: policyRevisions.rules,
    })
    .from(policyRevisions)
    .leftJoin(users, eq(users.id, policyRevisions.publishedBy))
    .orderBy(desc(policyRevisions.revision));
}

/** Live listings whose grace period has run out: the enforcement job's work list. */
export async function listingsPastGrace(now: Date, executor: Executor = db): Promise<{ id: string; graceUntil: Date }[]> {
  const rows = await executor
    .select({ id: listings.id, graceUntil: listings.graceUntil })
    .from(listings)
    .where(and(eq(listings.state, "live"), isNotNull(listings.graceUntil), sql`${listings.graceUntil} <= ${now.toISOString()}`))
    .orderBy(asc(listings.graceUntil));
  return rows.map((r) => ({ id: r.id, graceUntil: r.graceUntil! }));
}

/** Open (not yet held or resolved) failing re-check results of a listing. */
export function openRecheckResults(listingId: string) {
  return and(
    eq(policyRecheckResults.listingId, listingId),
    ne(policyRecheckResults.status, "clear"),
    isNull(policyRecheckResults.heldAt),
    isNull(policyRecheckResults.resolvedAt),
  );
}
