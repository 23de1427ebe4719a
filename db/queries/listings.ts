import "server-only";
import { randomBytes } from "node:crypto";
import { and, asc, count, desc, eq, ne, sql, type SQL } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import {
  listingCheckpoints,
  listingDecisions,
  listingDocuments,
  listingPhotos,
  listingRequirements,
  listings,
  uploads,
  users,
  type Listing,
  type ListingState,
} from "@/db/schema";
import type { SafetySheetCheck } from "@/lib/policy";
import type { TransitionActor } from "@/lib/listings/transitions";
import { deriveMagnetic } from "@/lib/listings/derived";
import { dispatchMail } from "@/lib/mail/outbox";
import { slugify } from "@/lib/validations/sellers";
import {
  magneticFiguresSchema,
  type CheckpointInput,
  type ListingDraft,
  type ListingSort,
  type RequirementInput,
} from "@/lib/validations/listings";
import { transitionListingInTx, TransitionError } from "./listing-transitions";
import { uploadsOwnedBy } from "./uploads";

type FieldErrors = Record<string, string[]>;

export class ListingError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422,
    message: string,
    readonly fieldErrors: FieldErrors = {},
    readonly check?: SafetySheetCheck,
  ) {
    super(message);
    this.name = "ListingError";
  }
}

type UserActor = Extract<TransitionActor, { kind: "user" }>;

// ——— What a moderator reviewed ———

/** The parts of a listing a moderator checks; everything else (price, stock, photos, wording) a seller may change freely. */
export type ReviewedContent = {
  magneticSubtype: string | null;
  figures: unknown;
  declaration: unknown;
  safetyNotes: unknown;
  checkpoints: unknown[];
  requirements: unknown[];
};

/** JSON with sorted keys and without null/undefined members, so equal content compares equal however it was stored. */
function canonical(value: unknown): string {
  const normalise = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(normalise);
    if (v && typeof v === "object") {
      return Object.fromEntries(
        Object.entries(v as Record<string, unknown>)
          .filter(([, inner]) => inner !== null && inner !== undefined)
          .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
          .map(([k, inner]) => [k, normalise(inner)]),
      );
    }
    return v;
  };
  return JSON.stringify(normalise(value));
}

function sortedNotes(notes: unknown): unknown {
  if (!Array.isArray(notes)) return notes;
  return [...notes].sort((a, b) => String((a as { topic?: string }).topic).localeCompare(String((b as { topic?: string }).topic)));
}

/**
 * The one rule for edits: a change to the safety sheet (declaration, notes) or to the figures
 * (kind-specific figures, subtype, checkpoints, requirements) must be reviewed again; price,
 * stock, photos, documents, title and description need not.
 */
export function reviewRelevantChanges(before: ReviewedContent, after: ReviewedContent): { sheet: boolean; figures: boolean } {
  const sheet =
    canonical(before.declaration) !== canonical(after.declaration) ||
    canonical(sortedNotes(before.safetyNotes)) !== canonical(sortedNotes(after.safetyNotes));
  const figures =
    (before.magneticSubtype ?? null) !== (after.magneticSubtype ?? null) ||
    canonical(before.figures) !== canonical(after.figures) ||
    canonical(before.checkpoints) !== canonical(after.checkpoints) ||
    canonical(before.requirements) !== canonical(after.requirements);
  return { sheet, figures };
}

// ——— Writing ———

type Prepared = {
  row: {
    kind: Listing["kind"];
    magneticSubtype: Listing["magneticSubtype"];
    title: string;
    descriptionMd: string;
    priceMinor: number;
    currency: string;
    stock: number;
    shippingWeightG: number;
    figures: Record<string, unknown>;
    declaration: Listing["declaration"];
    safetyNotes: Listing["safetyNotes"];
    inductanceH: number | null;
    ratedCurrentA: number | null;
  };
  photos: ListingDraft["photos"];
  documents: ListingDraft["documents"];
  checkpoints: CheckpointInput[];
  requirements: RequirementInput[];
};

function prepare(input: ListingDraft): Prepared {
  let figures: Record<string, unknown> = {};
  let inductanceH: number | null = null;
  let ratedCurrentA: number | null = null;
  if (input.kind === "magnetic") {
    figures = { ...input.figures };
    ratedCurrentA = input.figures.ratedCurrentA ?? null;
    // Matching needs the derived inductance; an incomplete draft has none yet.
    const complete = magneticFiguresSchema.safeParse(input.figures);
    if (complete.success) inductanceH = deriveMagnetic(input.magneticSubtype, complete.data).inductanceH;
  }
  return {
    row: {
      kind: input.kind,
      magneticSubtype: input.kind === "magnetic" ? input.magneticSubtype : null,
      title: input.title,
      descriptionMd: input.descriptionMd,
      priceMinor: input.price,
      currency: input.currency,
      stock: input.stock,
      shippingWeightG: input.shippingWeightG,
      figures,
      declaration: input.declaration,
      safetyNotes: input.notes,
      inductanceH,
      ratedCurrentA,
    },
    photos: input.photos,
    documents: input.documents,
    checkpoints: input.kind === "kit" ? input.checkpoints : [],
    requirements: input.kind === "kit" ? input.requirements : [],
  };
}

/** Only the seller's own, cleaned uploads of the right purpose may be attached. */
async function assertOwnUploads(tx: Tx, sellerId: string, prepared: Prepared): Promise<void> {
  const photoKeys = prepared.photos.map((p) => p.key);
  const documentKeys = prepared.documents.map((d) => d.key);
  const fieldErrors: FieldErrors = {};
  if (new Set(photoKeys).size !== photoKeys.length) fieldErrors.photos = ["The same photo is in the list twice."];
  if (new Set(documentKeys).size !== documentKeys.length) fieldErrors.documents = ["The same document is in the list twice."];
  if (Object.keys(fieldErrors).length > 0) throw new ListingError(422, "Remove the duplicate files.", fieldErrors);
  const keys = [...photoKeys, ...documentKeys];
  if (keys.length === 0) return;
  const owned = new Map((await uploadsOwnedBy(sellerId, keys, { executor: tx })).map((u) => [u.key, u]));
  const foreignPhoto = photoKeys.some((k) => owned.get(k)?.purpose !== "listing-photo");
  const foreignDocument = documentKeys.some((k) => owned.get(k)?.purpose !== "listing-document");
  if (foreignPhoto) fieldErrors.photos = ["One of these photos is not one you uploaded as a listing photo. Upload it again here."];
  if (foreignDocument) fieldErrors.documents = ["One of these documents is not one you uploaded as a listing document. Upload it again here."];
  if (foreignPhoto || foreignDocument) throw new ListingError(403, "Only files you uploaded yourself can be attached to your listing.", fieldErrors);
}

async function replaceChildren(tx: Tx, listingId: string, prepared: Prepared): Promise<void> {
  // One connection runs one statement at a time, so these go in sequence.
  await tx.delete(listingPhotos).where(eq(listingPhotos.listingId, listingId));
  await tx.delete(listingDocuments).where(eq(listingDocuments.listingId, listingId));
  await tx.delete(listingCheckpoints).where(eq(listingCheckpoints.listingId, listingId));
  await tx.delete(listingRequirements).where(eq(listingRequirements.listingId, listingId));
  if (prepared.photos.length > 0) {
    await tx.insert(listingPhotos).values(prepared.photos.map((p, position) => ({ listingId, uploadKey: p.key, alt: p.alt, position })));
  }
  if (prepared.documents.length > 0) {
    await tx
      .insert(listingDocuments)
      .values(prepared.documents.map((d, position) => ({ listingId, uploadKey: d.key, kind: d.kind, title: d.title, position })));
  }
  if (prepared.checkpoints.length > 0) {
    await tx.insert(listingCheckpoints).values(prepared.checkpoints.map((c, position) => ({ listingId, position, ...c })));
  }
  if (prepared.requirements.length > 0) {
    await tx.insert(listingRequirements).values(
      prepared.requirements.map((r) => ({
        listingId,
        subtype: r.subtype,
        label: r.label,
        minInductanceH: r.minInductanceH ?? null,
        atCurrentA: r.atCurrentA ?? null,
      })),
    );
  }
}

function newSlug(title: string): string {
  return `${slugify(title)}-${randomBytes(3).toString("hex")}`;
}

/** A new draft with its photos, documents, checkpoints and requirements, in one transaction. */
export async function createListingDraft(sellerId: string, input: ListingDraft): Promise<{ id: string; slug: string }> {
  const prepared = prepare(input);
  return db.transaction(async (tx) => {
    await assertOwnUploads(tx, sellerId, prepared);
    const [row] = await tx
      .insert(listings)
      .values({ sellerId, slug: newSlug(input.title), state: "draft", ...prepared.row })
      .returning({ id: listings.id, slug: listings.slug });
    if (!row) throw new Error("insert returned no row");
    await replaceChildren(tx, row.id, prepared);
    return row;
  });
}

async function reviewedContentOf(tx: Tx, listing: Listing): Promise<ReviewedContent> {
  const checkpoints = await tx
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
    .orderBy(asc(listingCheckpoints.position));
  const requirements = await tx
    .select({
      subtype: listingRequirements.subtype,
      label: listingRequirements.label,
      minInductanceH: listingRequirements.minInductanceH,
      atCurrentA: listingRequirements.atCurrentA,
    })
    .from(listingRequirements)
    .where(eq(listingRequirements.listingId, listing.id))
    .orderBy(asc(listingRequirements.id));
  return {
    magneticSubtype: listing.magneticSubtype,
    figures: listing.figures,
    declaration: listing.declaration,
    safetyNotes: listing.safetyNotes,
    checkpoints,
    requirements,
  };
}

function contentOf(prepared: Prepared): ReviewedContent {
  return {
    magneticSubtype: prepared.row.magneticSubtype,
    figures: prepared.row.figures,
    declaration: prepared.row.declaration,
    safetyNotes: prepared.row.safetyNotes,
    checkpoints: prepared.checkpoints,
    requirements: prepared.requirements,
  };
}

async function lockOwn(tx: Tx, sellerId: string, listingId: string): Promise<Listing> {
  if (!isUuid(listingId)) throw new ListingError(404, "No such listing.");
  const [listing] = await tx.select().from(listings).where(eq(listings.id, listingId)).for("update");
  // Someone else's listing is answered like a missing one, so ids cannot be probed.
  if (!listing || listing.sellerId !== sellerId) throw new ListingError(404, "No such listing.");
  return listing;
}

export type UpdateOutcome = { id: string; state: ListingState; sentToReview: boolean; sheetRevision: number };

/**
 * Saves an edit. A live listing whose safety sheet or figures changed goes back to review in the
 * same transaction (and must pass the sheet check to do so, else nothing is saved); a listing in
 * review takes only changes that need no review.
 */
export async function updateListing(actor: UserActor, listingId: string, input: ListingDraft): Promise<UpdateOutcome> {
  const prepared = prepare(input);
  const { outcome, mailIds } = await db.transaction(async (tx) => {
    const listing = await lockOwn(tx, actor.id, listingId);
    await assertOwnUploads(tx, actor.id, prepared);
    if (listing.state === "retired") throw new ListingError(409, "This listing is retired; it can no longer be edited.");
    if (listing.kind !== prepared.row.kind) throw new ListingError(422, "The kind of a listing cannot change; start a new listing instead.", { kind: ["The kind cannot change."] });
    const changes = reviewRelevantChanges(await reviewedContentOf(tx, listing), contentOf(prepared));
    const relevant = changes.sheet || changes.figures;
    if (listing.state === "in_review" && relevant) {
      throw new ListingError(409, "This listing is in review: its safety sheet and figures stay as submitted until a moderator decides. Price, stock and photos can still change.");
    }
    const sheetRevision = listing.sheetRevision + (changes.sheet ? 1 : 0);
    await tx
      .update(listings)
      .set({ ...prepared.row, sheetRevision, updatedAt: new Date() })
      .where(eq(listings.id, listing.id));
    await replaceChildren(tx, listing.id, prepared);
    if (listing.state === "live" && relevant) {
      const moved = await inTransition(() => transitionListingInTx(tx, { listingId: listing.id, action: "resubmit_after_edit", actor }));
      return { outcome: { id: listing.id, state: moved.result.to, sentToReview: true, sheetRevision }, mailIds: moved.mailIds };
    }
    return { outcome: { id: listing.id, state: listing.state, sentToReview: false, sheetRevision }, mailIds: [] as string[] };
  });
  await dispatchMail(mailIds);
  return outcome;
}

/** TransitionError → ListingError, so callers handle one kind of error. */
async function inTransition<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof TransitionError) {
      const fieldErrors: FieldErrors = error.check ? { sheet: error.check.findings.map((f) => f.message) } : {};
      throw new ListingError(error.status, error.message, fieldErrors, error.check);
    }
    throw error;
  }
}

/** Submits a draft or a sent-back listing; figures must be complete, and transitionListing checks the rest. */
export async function submitListing(actor: UserActor, listingId: string): Promise<{ state: ListingState }> {
  const { state, mailIds } = await db.transaction(async (tx) => {
    const listing = await lockOwn(tx, actor.id, listingId);
    if (listing.kind === "magnetic" && !magneticFiguresSchema.safeParse(listing.figures).success) {
      throw new ListingError(409, "Fill in every figure of the magnetic (core, gap, windings, rated current, frequency) before submitting.");
    }
    const moved = await inTransition(() => transitionListingInTx(tx, { listingId: listing.id, action: "submit", actor }));
    return { state: moved.result.to, mailIds: moved.mailIds };
  });
  await dispatchMail(mailIds);
  return { state };
}

export async function retireListing(actor: UserActor, listingId: string): Promise<{ state: ListingState }> {
  const { state, mailIds } = await db.transaction(async (tx) => {
    const listing = await lockOwn(tx, actor.id, listingId);
    const moved = await inTransition(() => transitionListingInTx(tx, { listingId: listing.id, action: "retire", actor }));
    return { state: moved.result.to, mailIds: moved.mailIds };
  });
  await dispatchMail(mailIds);
  return { state };
}

/**
 * Sets the stock of the seller's own listing. One conditional statement: the owner, the state
 * and the non-negative bound are all in the WHERE clause, so nothing is read and then overwritten.
 */
export async function setStock(sellerId: string, listingId: string, stock: number): Promise<{ stock: number }> {
  if (!Number.isInteger(stock) || stock < 0) throw new ListingError(422, "Stock must be a whole number, 0 or more.", { stock: ["Stock must be a whole number, 0 or more."] });
  return changeStock(sellerId, listingId, sql`${stock}`);
}

/** Adds to or takes from the stock; refused (409) when it would go below zero. */
export async function adjustStock(sellerId: string, listingId: string, delta: number): Promise<{ stock: number }> {
  if (!Number.isInteger(delta)) throw new ListingError(422, "A stock change is a whole number.");
  return changeStock(sellerId, listingId, sql`${listings.stock} + ${delta}`);
}

async function changeStock(sellerId: string, listingId: string, next: SQL): Promise<{ stock: number }> {
  if (!isUuid(listingId)) throw new ListingError(404, "No such listing.");
  const [row] = await db
    .update(listings)
    .set({ stock: next, updatedAt: new Date() })
    .where(and(eq(listings.id, listingId), eq(listings.sellerId, sellerId), ne(listings.state, "retired"), sql`${next} >= 0`, sql`${next} <= 10000`))
    .returning({ stock: listings.stock });
  if (row) return row;
  const [own] = await db.select({ state: listings.state }).from(listings).where(and(eq(listings.id, listingId), eq(listings.sellerId, sellerId)));
  if (!own) throw new ListingError(404, "No such listing.");
  if (own.state === "retired") throw new ListingError(409, "This listing is retired; its stock no longer changes.");
  throw new ListingError(409, "Stock cannot go below 0 or above 10 000.", { stock: ["Stock cannot go below 0 or above 10 000."] });
}

// ——— Reading ———

export type SellerListingRow = {
  id: string;
  slug: string;
  title: string;
  kind: Listing["kind"];
  magneticSubtype: Listing["magneticSubtype"];
  state: ListingState;
  priceMinor: number;
  currency: string;
  stock: number;
  moderatorMessage: string | null;
  policyStatus: string | null;
  photoCount: number;
  updatedAt: Date;
};

// The life-cycle order reads better than the alphabet when sorting by state.
const STATE_ORDER = sql`array_position(array['draft','sent_back','in_review','live','held','retired']::listing_state[], ${listings.state})`;

export async function listSellerListings(sellerId: string, sort: { sort: ListingSort; dir: "asc" | "desc" } = { sort: "updated", dir: "desc" }): Promise<SellerListingRow[]> {
  const column: Record<ListingSort, SQL> = {
    title: sql`lower(${listings.title})`,
    state: STATE_ORDER,
    price: sql`${listings.priceMinor}`,
    stock: sql`${listings.stock}`,
    updated: sql`${listings.updatedAt}`,
  };
  const by = sort.dir === "asc" ? asc(column[sort.sort]) : desc(column[sort.sort]);
  const photoCount = db
    .select({ listingId: listingPhotos.listingId, n: count().as("n") })
    .from(listingPhotos)
    .groupBy(listingPhotos.listingId)
    .as("photo_count");
  const rows = await db
    .select({
      id: listings.id,
      slug: listings.slug,
      title: listings.title,
      kind: listings.kind,
      magneticSubtype: listings.magneticSubtype,
      state: listings.state,
      priceMinor: listings.priceMinor,
      currency: listings.currency,
      stock: listings.stock,
      moderatorMessage: listings.moderatorMessage,
      policyStatus: listings.policyStatus,
      photoCount: sql<number>`coalesce(${photoCount.n}, 0)::int`,
      updatedAt: listings.updatedAt,
    })
    .from(listings)
    .leftJoin(photoCount, eq(photoCount.listingId, listings.id))
    .where(eq(listings.sellerId, sellerId))
    .orderBy(by, asc(listings.id));
  return rows;
}

export type OwnListing = NonNullable<Awaited<ReturnType<typeof getListingForOwner>>>;

/** One listing with everything the edit page shows, or null when it is not the seller's. */
export async function getListingForOwner(sellerId: string, listingId: string) {
  if (!isUuid(listingId)) return null;
  const [listing] = await db.select().from(listings).where(and(eq(listings.id, listingId), eq(listings.sellerId, sellerId)));
  if (!listing) return null;
  const [photos, documents, checkpoints, requirements, decisions] = await Promise.all([
    db
      .select({ key: listingPhotos.uploadKey, alt: listingPhotos.alt, position: listingPhotos.position, url: uploads.url, thumbUrl: uploads.thumbUrl })
      .from(listingPhotos)
      .innerJoin(uploads, eq(uploads.key, listingPhotos.uploadKey))
      .where(eq(listingPhotos.listingId, listing.id))
      .orderBy(asc(listingPhotos.position)),
    db
      .select({ key: listingDocuments.uploadKey, kind: listingDocuments.kind, title: listingDocuments.title, url: uploads.url })
      .from(listingDocuments)
      .innerJoin(uploads, eq(uploads.key, listingDocuments.uploadKey))
      .where(eq(listingDocuments.listingId, listing.id))
      .orderBy(asc(listingDocuments.position)),
    db.select().from(listingCheckpoints).where(eq(listingCheckpoints.listingId, listing.id)).orderBy(asc(listingCheckpoints.position)),
    db.select().from(listingRequirements).where(eq(listingRequirements.listingId, listing.id)).orderBy(asc(listingRequirements.id)),
    db
      .select({
        id: listingDecisions.id,
        decision: listingDecisions.decision,
        reasons: listingDecisions.reasons,
        note: listingDecisions.note,
        policyRevision: listingDecisions.policyRevision,
        createdAt: listingDecisions.createdAt,
        actorName: users.name,
        actorId: listingDecisions.actorId,
      })
      .from(listingDecisions)
      .leftJoin(users, eq(users.id, listingDecisions.actorId))
      .where(eq(listingDecisions.listingId, listing.id))
      .orderBy(desc(listingDecisions.createdAt)),
  ]);
  return { listing, photos, documents, checkpoints, requirements, decisions };
}

/** Listings per state for the desk's summary line. */
export async function countSellerListingsByState(sellerId: string): Promise<Partial<Record<ListingState, number>>> {
  const rows = await db.select({ state: listings.state, n: count() }).from(listings).where(eq(listings.sellerId, sellerId)).groupBy(listings.state);
  return Object.fromEntries(rows.map((r) => [r.state, r.n]));
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
function isUuid(id: string): boolean {
  return UUID.test(id);
}
