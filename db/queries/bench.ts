import "server-only";
import { and, asc, count, desc, eq, inArray, max, or } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db/client";
import {
  bringUpLogs,
  listingCheckpoints,
  listings,
  logCheckpoints,
  orderLines,
  orders,
  readingPhotos,
  readings,
  reviewSessions,
  uploads,
  users,
  type BringUpStage,
  type LogCheckpoint,
  type OrderState,
  type ReadingVerdict,
  type ReviewState,
  type Role,
} from "@/db/schema";
import { decideLogAccess, type LogAccess, type LogViewer } from "@/lib/bench/log-access";
import { stageOrder, summariseProgress, type StageProgress } from "@/lib/bench/progress";
import { toCheckpointUnit } from "@/lib/bench/unit-choices";
import { classifyReading } from "@/lib/engineering";
import type { BuilderCheckpointInput, CreateLogInput, ReadingInput } from "@/lib/validations/bench";
import { uploadsOwnedBy } from "./uploads";

export type { LogAccess, LogViewer } from "@/lib/bench/log-access";

/** A refusal with the status a route would answer and, where it names one, the field it is about. */
export class BenchError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = "BenchError";
  }
}

/** Orders in these states are kits the builder has paid for (a refund or cancellation takes it back). */
const BOUGHT_STATES: OrderState[] = ["paid", "shipped", "delivered"];

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const NOT_FOUND = "There is no such log, or it is not shared with you.";

// ——— Kits a log can start from ———

export type KitChoice = { id: string; title: string; slug: string; checkpoints: number };

async function boughtKitIds(ownerId: string, executor: Executor): Promise<string[]> {
  const rows = await executor
    .selectDistinct({ id: listings.id })
    .from(orderLines)
    .innerJoin(orders, eq(orders.id, orderLines.orderId))
    .innerJoin(listings, eq(listings.id, orderLines.listingId))
    .where(and(eq(orders.buyerId, ownerId), inArray(orders.state, BOUGHT_STATES), eq(listings.kind, "kit")));
  return rows.map((r) => r.id);
}

/**
 * The kits a member may start a log from: the ones they bought (first), then every other kit in
 * the catalog — a builder may have bought theirs elsewhere.
 */
export async function kitChoicesFor(ownerId: string): Promise<{ bought: KitChoice[]; catalog: KitChoice[] }> {
  const boughtIds = await boughtKitIds(ownerId, db);
  const rows = await db
    .select({ id: listings.id, title: listings.title, slug: listings.slug, state: listings.state, checkpoints: count(listingCheckpoints.id) })
    .from(listings)
    .leftJoin(listingCheckpoints, eq(listingCheckpoints.listingId, listings.id))
    .where(and(eq(listings.kind, "kit"), boughtIds.length > 0 ? or(eq(listings.state, "live"), inArray(listings.id, boughtIds)) : eq(listings.state, "live")))
    .groupBy(listings.id)
    .orderBy(asc(listings.title));
  const bought = new Set(boughtIds);
  const choice = ({ id, title, slug, checkpoints }: (typeof rows)[number]): KitChoice => ({ id, title, slug, checkpoints });
  return {
    bought: rows.filter((r) => bought.has(r.id)).map(choice),
    catalog: rows.filter((r) => !bought.has(r.id) && r.state === "live").map(choice),
  };
}

// ——— Writing ———

/**
 * A new log, for a kit (its checkpoints copied in, in one transaction) or a build of the owner's
 * own (no checkpoints yet). A kit must be in the catalog or one the owner bought.
 */
export async function createLog(ownerId: string, input: CreateLogInput): Promise<{ id: string; checkpoints: number }> {
  return db.transaction(async (tx) => {
    let title = input.title;
    const kitId = input.kitListingId === "" ? null : input.kitListingId;
    if (kitId !== null) {
      const [kit] = await tx
        .select({ id: listings.id, title: listings.title, kind: listings.kind, state: listings.state })
        .from(listings)
        .where(eq(listings.id, kitId));
      const mayUse = kit?.kind === "kit" && (kit.state === "live" || (await boughtKitIds(ownerId, tx)).includes(kit.id));
      if (!kit || !mayUse) throw new BenchError(404, "That kit is not in the catalog.", { kitListingId: ["Choose a kit from the list."] });
      if (title === "") title = kit.title;
    }
    const [log] = await tx.insert(bringUpLogs).values({ ownerId, kitListingId: kitId, title }).returning({ id: bringUpLogs.id });
    if (!log) throw new Error("inserting a bring-up log returned no row");
    if (kitId === null) return { id: log.id, checkpoints: 0 };
    const source = await tx.select().from(listingCheckpoints).where(eq(listingCheckpoints.listingId, kitId)).orderBy(asc(listingCheckpoints.position));
    if (source.length > 0) {
      await tx.insert(logCheckpoints).values(
        source.map((c) => ({
          logId: log.id,
          sourceCheckpointId: c.id,
          position: c.position,
          stage: c.stage,
          name: c.name,
          measure: c.measure,
          unit: c.unit,
          expectedMin: c.expectedMin,
          expectedMax: c.expectedMax,
        })),
      );
    }
    return { id: log.id, checkpoints: source.length };
  });
}

/** The member acting: their id and roles, as the session guard gives them. */
export type BenchActor = { id: string; roles: readonly Role[] };
type Actor = BenchActor;

/**
 * Locks the log for a change by its owner. Anyone else is told it is not found, unless they may
 * read it (a public log, a reviewer, a moderator): then it is 403, since they know it exists.
 */
async function lockOwnLog(tx: Tx, actor: Actor, logId: string): Promise<{ id: string }> {
  if (!UUID.test(logId)) throw new BenchError(404, NOT_FOUND);
  const [log] = await tx
    .select({ id: bringUpLogs.id, ownerId: bringUpLogs.ownerId, visibility: bringUpLogs.visibility })
    .from(bringUpLogs)
    .where(eq(bringUpLogs.id, logId))
    .for("update");
  if (!log) throw new BenchError(404, NOT_FOUND);
  if (log.ownerId === actor.id) return log;
  const access = decideLogAccess({ viewer: actor, ownerId: log.ownerId, visibility: log.visibility, reviewerSessionStates: await sessionStates(tx, actor.id, logId) });
  if (access === null) throw new BenchError(404, NOT_FOUND);
  throw new BenchError(403, "Only the builder who keeps this log can change it.");
}

const touch = (tx: Tx, logId: string) => tx.update(bringUpLogs).set({ updatedAt: new Date() }).where(eq(bringUpLogs.id, logId));

/** A checkpoint of the builder's own, at the end of its stage. */
export async function addCheckpoint(actor: Actor, logId: string, input: BuilderCheckpointInput): Promise<{ id: string }> {
  return db.transaction(async (tx) => {
    await lockOwnLog(tx, actor, logId);
    const [last] = await tx.select({ position: max(logCheckpoints.position) }).from(logCheckpoints).where(eq(logCheckpoints.logId, logId));
    const [row] = await tx
      .insert(logCheckpoints)
      .values({ logId, position: (last?.position ?? -1) + 1, addedByBuilder: true, ...input })
      .returning({ id: logCheckpoints.id });
    if (!row) throw new Error("inserting a checkpoint returned no row");
    await touch(tx, logId);
    return row;
  });
}

export type RecordedReading = { id: string; value: number; unit: string; verdict: ReadingVerdict; farOutside: boolean };

/**
 * Records a reading by the log's owner: converted to the checkpoint's unit, classified against
 * its range, with the owner's own reading photos — all in one transaction, so a refusal writes
 * nothing.
 */
export async function recordReading(actor: Actor, logId: string, input: ReadingInput): Promise<RecordedReading> {
  return db.transaction(async (tx) => {
    await lockOwnLog(tx, actor, logId);
    const [checkpoint] = await tx
      .select()
      .from(logCheckpoints)
      .where(and(eq(logCheckpoints.id, input.checkpointId), eq(logCheckpoints.logId, logId)));
    if (!checkpoint) throw new BenchError(404, "That checkpoint is not part of this log.", { checkpointId: ["Choose a checkpoint of this log."] });

    const converted = toCheckpointUnit(input.value, input.unit, checkpoint.unit);
    if (!converted.ok) throw new BenchError(422, converted.message, { unit: [converted.message] });
    const { verdict, farOutside } = classifyReading({ value: converted.value, min: checkpoint.expectedMin, max: checkpoint.expectedMax });

    await assertOwnPhotos(tx, actor.id, input.photos.map((p) => p.key));
    const [reading] = await tx
      .insert(readings)
      .values({
        logId,
        checkpointId: checkpoint.id,
        value: converted.value,
        enteredValue: input.value,
        enteredUnit: input.unit,
        verdict,
        farOutside,
        instrument: input.instrument,
        note: input.note,
      })
      .returning({ id: readings.id });
    if (!reading) throw new Error("inserting a reading returned no row");
    if (input.photos.length > 0) {
      await tx.insert(readingPhotos).values(input.photos.map((p, position) => ({ readingId: reading.id, uploadKey: p.key, position, caption: p.alt })));
    }
    await touch(tx, logId);
    return { id: reading.id, value: converted.value, unit: checkpoint.unit, verdict, farOutside };
  });
}

/** Only reading photos the owner uploaded, each on one reading only. */
async function assertOwnPhotos(tx: Tx, ownerId: string, keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  if (new Set(keys).size !== keys.length) throw new BenchError(422, "The same photo is in the list twice.", { photos: ["Remove the duplicate photo."] });
  const owned = await uploadsOwnedBy(ownerId, keys, { purpose: "reading-photo", executor: tx });
  if (owned.length !== keys.length) {
    throw new BenchError(403, "Only photos you uploaded yourself for a reading can be attached.", { photos: ["One of these photos is not one you uploaded here. Upload it again."] });
  }
  const taken = await tx.select({ key: readingPhotos.uploadKey }).from(readingPhotos).where(inArray(readingPhotos.uploadKey, keys)).limit(1);
  if (taken.length > 0) throw new BenchError(409, "One of these photos is already attached to another reading.", { photos: ["Upload the photo again for this reading."] });
}

/** Private (the default) or public, for linking from a question; review bookings share a log on their own. */
export async function setVisibility(actor: Actor, logId: string, visibility: "private" | "public"): Promise<void> {
  await db.transaction(async (tx) => {
    await lockOwnLog(tx, actor, logId);
    await tx.update(bringUpLogs).set({ visibility, updatedAt: new Date() }).where(eq(bringUpLogs.id, logId));
  });
}

// ——— Reading ———

async function sessionStates(executor: Executor, reviewerId: string, logId: string): Promise<ReviewState[]> {
  const rows = await executor
    .select({ state: reviewSessions.state })
    .from(reviewSessions)
    .where(and(eq(reviewSessions.logId, logId), eq(reviewSessions.reviewerId, reviewerId)));
  return rows.map((r) => r.state);
}

export type LogSummary = {
  id: string;
  title: string;
  kit: { title: string; slug: string } | null;
  visibility: "private" | "public";
  createdAt: Date;
  updatedAt: Date;
  progress: StageProgress[];
};

/** Latest reading per checkpoint of the given logs; enough for the progress view. */
async function latestVerdicts(logIds: string[], executor: Executor) {
  if (logIds.length === 0) return [];
  return executor
    .selectDistinctOn([readings.checkpointId], { checkpointId: readings.checkpointId, verdict: readings.verdict, takenAt: readings.takenAt })
    .from(readings)
    .where(inArray(readings.logId, logIds))
    .orderBy(readings.checkpointId, desc(readings.takenAt), desc(readings.id));
}

/** The owner's logs, most recently worked on first, each with its stage-by-stage progress. */
export async function listLogs(ownerId: string): Promise<LogSummary[]> {
  const logs = await db
    .select({
      id: bringUpLogs.id,
      title: bringUpLogs.title,
      visibility: bringUpLogs.visibility,
      createdAt: bringUpLogs.createdAt,
      updatedAt: bringUpLogs.updatedAt,
      kitTitle: listings.title,
      kitSlug: listings.slug,
    })
    .from(bringUpLogs)
    .leftJoin(listings, eq(listings.id, bringUpLogs.kitListingId))
    .where(eq(bringUpLogs.ownerId, ownerId))
    .orderBy(desc(bringUpLogs.updatedAt));
  const ids = logs.map((l) => l.id);
  const [checkpoints, latest] = await Promise.all([
    ids.length === 0 ? [] : db.select({ id: logCheckpoints.id, logId: logCheckpoints.logId, stage: logCheckpoints.stage }).from(logCheckpoints).where(inArray(logCheckpoints.logId, ids)),
    latestVerdicts(ids, db),
  ]);
  return logs.map((l) => ({
    id: l.id,
    title: l.title,
    kit: l.kitTitle !== null && l.kitSlug !== null ? { title: l.kitTitle, slug: l.kitSlug } : null,
    visibility: l.visibility,
    createdAt: l.createdAt,
    updatedAt: l.updatedAt,
    progress: summariseProgress(
      checkpoints.filter((c) => c.logId === l.id),
      latest,
    ),
  }));
}

/** The log's checkpoints in bring-up order: stage by stage, then as the kit (or builder) listed them. */
export async function logCheckpointsOf(logId: string, executor: Executor = db): Promise<LogCheckpoint[]> {
  if (!UUID.test(logId)) return [];
  const rows = await executor.select().from(logCheckpoints).where(eq(logCheckpoints.logId, logId));
  return rows.sort((a, b) => stageOrder(a.stage) - stageOrder(b.stage) || a.position - b.position);
}

export type ReadingPhotoView = { key: string; url: string; thumbUrl: string; caption: string };

export type ReadingView = {
  id: string;
  checkpointId: string;
  value: number;
  enteredValue: number;
  enteredUnit: string;
  verdict: ReadingVerdict;
  farOutside: boolean;
  instrument: string;
  note: string;
  takenAt: Date;
  photos: ReadingPhotoView[];
};

export type CheckpointView = LogCheckpoint & { stage: BringUpStage; readings: ReadingView[] };

export type LogView = {
  id: string;
  title: string;
  notesMd: string;
  visibility: "private" | "public";
  owner: { id: string; name: string };
  kit: { id: string; title: string; slug: string } | null;
  createdAt: Date;
  updatedAt: Date;
  /** why this viewer may read it */
  access: LogAccess;
  /** only the owner records readings, adds checkpoints and changes the visibility */
  canEdit: boolean;
  /** in bring-up order; each checkpoint's readings oldest first */
  checkpoints: CheckpointView[];
  progress: StageProgress[];
};

/**
 * The log as this viewer may see it, or null when they may not (or it does not exist — the two
 * look the same, so a private log's existence is not revealed). The owner always; anyone when it
 * is public; a reviewer whose session on it is accepted, delivered, closed or disputed; moderators.
 * Everyone but the owner reads it only.
 */
export async function getLogForViewer(viewer: LogViewer, logId: string): Promise<LogView | null> {
  if (!UUID.test(logId)) return null;
  const [log] = await db
    .select({
      id: bringUpLogs.id,
      title: bringUpLogs.title,
      notesMd: bringUpLogs.notesMd,
      visibility: bringUpLogs.visibility,
      ownerId: bringUpLogs.ownerId,
      ownerName: users.name,
      ownerEmail: users.email,
      kitId: listings.id,
      kitTitle: listings.title,
      kitSlug: listings.slug,
      createdAt: bringUpLogs.createdAt,
      updatedAt: bringUpLogs.updatedAt,
    })
    .from(bringUpLogs)
    .innerJoin(users, eq(users.id, bringUpLogs.ownerId))
    .leftJoin(listings, eq(listings.id, bringUpLogs.kitListingId))
    .where(eq(bringUpLogs.id, logId));
  if (!log) return null;
  const states = viewer && viewer.id !== log.ownerId ? await sessionStates(db, viewer.id, logId) : [];
  const access = decideLogAccess({ viewer, ownerId: log.ownerId, visibility: log.visibility, reviewerSessionStates: states });
  if (access === null) return null;

  const [checkpoints, readingRows, photoRows] = await Promise.all([
    logCheckpointsOf(logId),
    db.select().from(readings).where(eq(readings.logId, logId)).orderBy(asc(readings.takenAt), asc(readings.id)),
    db
      .select({ readingId: readingPhotos.readingId, key: uploads.key, url: uploads.url, thumbUrl: uploads.thumbUrl, caption: readingPhotos.caption })
      .from(readingPhotos)
      .innerJoin(readings, eq(readings.id, readingPhotos.readingId))
      .innerJoin(uploads, eq(uploads.key, readingPhotos.uploadKey))
      .where(eq(readings.logId, logId))
      .orderBy(asc(readingPhotos.position)),
  ]);
  const photosOf = new Map<string, ReadingPhotoView[]>();
  for (const p of photoRows) {
    const list = photosOf.get(p.readingId) ?? [];
    list.push({ key: p.key, url: p.url, thumbUrl: p.thumbUrl ?? p.url, caption: p.caption });
    photosOf.set(p.readingId, list);
  }
  const readingViews: ReadingView[] = readingRows.map((r) => ({
    id: r.id,
    checkpointId: r.checkpointId,
    value: r.value,
    enteredValue: r.enteredValue,
    enteredUnit: r.enteredUnit,
    verdict: r.verdict,
    farOutside: r.farOutside,
    instrument: r.instrument,
    note: r.note,
    takenAt: r.takenAt,
    photos: photosOf.get(r.id) ?? [],
  }));

  return {
    id: log.id,
    title: log.title,
    notesMd: log.notesMd,
    visibility: log.visibility,
    // An address is not shown to other readers; a member without a name is "a Fluxyard builder".
    owner: { id: log.ownerId, name: log.ownerName ?? (access === "owner" ? (log.ownerEmail ?? "you") : "A Fluxyard builder") },
    kit: log.kitId !== null && log.kitTitle !== null && log.kitSlug !== null ? { id: log.kitId, title: log.kitTitle, slug: log.kitSlug } : null,
    createdAt: log.createdAt,
    updatedAt: log.updatedAt,
    access,
    canEdit: access === "owner",
    checkpoints: checkpoints.map((c) => ({ ...c, readings: readingViews.filter((r) => r.checkpointId === c.id) })),
    progress: summariseProgress(checkpoints, readingViews),
  };
}
