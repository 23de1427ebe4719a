import "server-only";
import { and, asc, count, eq, gte, inArray, lt, lte, or, sql } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db/client";
import {
  bringUpLogs,
  captureBlocks,
  captureChannels,
  capturePins,
  captures,
  logCheckpoints,
  readings,
  reviewSessions,
  uploads,
  users,
  type Capture,
  type ReviewState,
} from "@/db/schema";
import { decideLogAccess, REVIEWER_READ_STATES, type LogAccess, type LogViewer } from "@/lib/bench/log-access";
import { decodeFloat32, decodeFloat64, TIME_SERIES, type SampleBlock } from "@/lib/captures/blocks";
import { decidePin, pinScope } from "@/lib/captures/pin-rules";
import type { PinInput } from "@/lib/captures/pin-schema";
import { proposalForChannel, proposeReading } from "@/lib/captures/proposal";
import type { CaptureChannelView, CapturePinView } from "@/lib/captures/types";
import { classifyReading, type PulseMeasurement } from "@/lib/engineering";
import { BenchError, type BenchActor, type RecordedReading } from "./bench";
import { deleteUpload, uploadsOwnedBy } from "./uploads";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const NO_LOG = "There is no such log, or it is not shared with you.";
const NO_CAPTURE = "There is no such capture, or it is not shared with you.";

/** A reading carries a few captures (one per probe point or setting), as many as one upload request takes. */
export const MAX_CAPTURES_PER_READING = 4;

// ——— Access ———

async function reviewerStates(executor: Executor, reviewerId: string, logId: string): Promise<ReviewState[]> {
  const rows = await executor
    .select({ state: reviewSessions.state })
    .from(reviewSessions)
    .where(and(eq(reviewSessions.logId, logId), eq(reviewSessions.reviewerId, reviewerId)));
  return rows.map((r) => r.state);
}

async function accessTo(executor: Executor, viewer: LogViewer, log: { ownerId: string; visibility: "private" | "public"; id: string }): Promise<LogAccess | null> {
  const states = viewer && viewer.id !== log.ownerId ? await reviewerStates(executor, viewer.id, log.id) : [];
  return decideLogAccess({ viewer, ownerId: log.ownerId, visibility: log.visibility, reviewerSessionStates: states });
}

/** Locks the log for its owner's change; anyone who may read it gets 403, anyone else 404 (as the bench does). */
async function lockOwnLog(tx: Tx, actor: BenchActor, logId: string): Promise<void> {
  if (!UUID.test(logId)) throw new BenchError(404, NO_LOG);
  const [log] = await tx
    .select({ id: bringUpLogs.id, ownerId: bringUpLogs.ownerId, visibility: bringUpLogs.visibility })
    .from(bringUpLogs)
    .where(eq(bringUpLogs.id, logId))
    .for("update");
  if (!log) throw new BenchError(404, NO_LOG);
  if (log.ownerId === actor.id) return;
  if ((await accessTo(tx, actor, log)) === null) throw new BenchError(404, NO_LOG);
  throw new BenchError(403, "Only the builder who keeps this log can change its captures.");
}

const touchLog = (tx: Tx, logId: string) => tx.update(bringUpLogs).set({ updatedAt: new Date() }).where(eq(bringUpLogs.id, logId));

// ——— Attaching and measuring ———

export type AttachedCapture = { id: string; bytes: number };

/** A capture the owner uploaded (the `capture` upload route), attached to one of the log's readings, queued for measuring. */
export async function attachCapture(actor: BenchActor, logId: string, input: { readingId: string; uploadKey: string }): Promise<AttachedCapture> {
  return db.transaction(async (tx) => {
    await lockOwnLog(tx, actor, logId);
    const [reading] = UUID.test(input.readingId)
      ? await tx.select({ id: readings.id }).from(readings).where(and(eq(readings.id, input.readingId), eq(readings.logId, logId)))
      : [];
    if (!reading) throw new BenchError(404, "That reading is not part of this log.", { readingId: ["Choose a reading of this checkpoint."] });

    const [upload] = await uploadsOwnedBy(actor.id, [input.uploadKey], { purpose: "capture", executor: tx });
    if (!upload) {
      throw new BenchError(403, "Only a capture you uploaded yourself can be attached.", { uploadKey: ["Upload the capture file again."] });
    }
    const [taken] = await tx.select({ id: captures.id }).from(captures).where(eq(captures.uploadKey, upload.key));
    if (taken) throw new BenchError(409, "This capture file is already attached to a reading.", { uploadKey: ["Upload the file again to attach it here too."] });
    const [held] = await tx.select({ n: count() }).from(captures).where(eq(captures.readingId, reading.id));
    if ((held?.n ?? 0) >= MAX_CAPTURES_PER_READING) {
      throw new BenchError(409, `A reading carries at most ${MAX_CAPTURES_PER_READING} captures; remove one first.`, { uploadKey: ["Remove a capture of this reading first."] });
    }
    const [row] = await tx.insert(captures).values({ logId, readingId: reading.id, uploadKey: upload.key }).returning({ id: captures.id });
    if (!row) throw new Error("inserting a capture returned no row");
    await touchLog(tx, logId);
    return { id: row.id, bytes: upload.bytes };
  });
}

export type ClaimedCapture = { id: string; url: string; bytes: number; name: string };

/** A capture measured by nobody else right now; one measuring for over 10 minutes was left by a stopped worker. */
const STALE_MEASURING = sql`now() - interval '10 minutes'`;

/**
 * Takes a capture for measuring (queued → measuring) with a conditional update, so the inline
 * path, the job and the sweep never measure one capture twice at once. Null when it is not there
 * to take (measured, failed, or being measured).
 */
export async function claimCapture(captureId: string): Promise<ClaimedCapture | null> {
  if (!UUID.test(captureId)) return null;
  const [claimed] = await db
    .update(captures)
    .set({ state: "measuring", progress: 1, errorMessage: null, updatedAt: new Date() })
    .where(and(eq(captures.id, captureId), or(eq(captures.state, "queued"), and(eq(captures.state, "measuring"), lt(captures.updatedAt, STALE_MEASURING)))))
    .returning({ id: captures.id, uploadKey: captures.uploadKey });
  if (!claimed) return null;
  const [upload] = await db.select({ url: uploads.url, bytes: uploads.bytes, name: uploads.originalName }).from(uploads).where(eq(uploads.key, claimed.uploadKey));
  if (!upload) throw new Error(`capture ${captureId} has no upload row`);
  return { id: claimed.id, ...upload };
}

export async function setCaptureProgress(captureId: string, progress: number): Promise<void> {
  await db
    .update(captures)
    .set({ progress: Math.max(1, Math.min(99, Math.round(progress))), updatedAt: new Date() })
    .where(and(eq(captures.id, captureId), eq(captures.state, "measuring")));
}

/** Gives a claimed capture back to the queue (a passing failure: the store did not answer). */
export async function releaseCapture(captureId: string): Promise<void> {
  await db
    .update(captures)
    .set({ state: "queued", progress: 0, updatedAt: new Date() })
    .where(and(eq(captures.id, captureId), eq(captures.state, "measuring")));
}

export async function failCapture(captureId: string, message: string): Promise<void> {
  await db
    .update(captures)
    .set({ state: "failed", errorMessage: message.slice(0, 2000), updatedAt: new Date() })
    .where(and(eq(captures.id, captureId), eq(captures.state, "measuring")));
}

export type MeasuredCapture = {
  sampleCount: number;
  startTimeS: number;
  endTimeS: number;
  sampleIntervalS: number;
  evenlySpaced: boolean;
  channels: { name: string; unit: string | null; minValue: number; maxValue: number; figures: PulseMeasurement }[];
  blocks: SampleBlock[];
};

// A block of 64 Ki Float32 samples is 256 KiB; eight to a statement keeps each insert a few MiB.
const BLOCKS_PER_INSERT = 8;

/** Stores the figures and the sample blocks and marks the capture measured, all or nothing. */
export async function storeMeasurement(captureId: string, measured: MeasuredCapture): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.delete(captureChannels).where(eq(captureChannels.captureId, captureId));
    await tx.delete(captureBlocks).where(eq(captureBlocks.captureId, captureId));
    if (measured.channels.length > 0) {
      await tx.insert(captureChannels).values(measured.channels.map((c, position) => ({ captureId, position, ...c })));
    }
    for (let i = 0; i < measured.blocks.length; i += BLOCKS_PER_INSERT) {
      await tx.insert(captureBlocks).values(measured.blocks.slice(i, i + BLOCKS_PER_INSERT).map((b) => ({ captureId, ...b })));
    }
    const done = await tx
      .update(captures)
      .set({
        state: "measured",
        progress: 100,
        errorMessage: null,
        sampleCount: measured.sampleCount,
        startTimeS: measured.startTimeS,
        endTimeS: measured.endTimeS,
        sampleIntervalS: measured.sampleIntervalS,
        evenlySpaced: measured.evenlySpaced,
        measuredAt: new Date(),
        updatedAt: new Date(),
      })
      .where(and(eq(captures.id, captureId), eq(captures.state, "measuring")))
      .returning({ id: captures.id });
    // Removed (or taken over) while being measured: keep nothing.
    if (done.length === 0) throw new CaptureGoneError(captureId);
  });
}

export class CaptureGoneError extends Error {
  constructor(captureId: string) {
    super(`capture ${captureId} is no longer being measured here`);
    this.name = "CaptureGoneError";
  }
}

/** Captures whose job never ran (the queue was unreachable) or whose worker stopped mid-way. */
export async function strandedCaptureIds(limit = 5): Promise<string[]> {
  const rows = await db
    .select({ id: captures.id })
    .from(captures)
    .where(
      or(
        and(eq(captures.state, "queued"), lt(captures.updatedAt, sql`now() - interval '1 minute'`)),
        and(eq(captures.state, "measuring"), lt(captures.updatedAt, STALE_MEASURING)),
      ),
    )
    .orderBy(asc(captures.updatedAt))
    .limit(limit);
  return rows.map((r) => r.id);
}

// ——— Reading ———

export type CaptureDetail = {
  capture: Capture;
  access: LogAccess;
  /** only the owner confirms, removes or attaches */
  canEdit: boolean;
  log: { id: string; title: string; ownerId: string };
  upload: { name: string; bytes: number; url: string };
  reading: { id: string; value: number; enteredValue: number; enteredUnit: string; verdict: "within" | "low" | "high"; farOutside: boolean; takenAt: Date };
  checkpoint: { id: string; name: string; measure: string; unit: string; stage: string; expectedMin: number; expectedMax: number };
  channels: CaptureChannelView[];
};

async function channelsOf(captureIds: string[]): Promise<Map<string, CaptureChannelView[]>> {
  const byCapture = new Map<string, CaptureChannelView[]>();
  if (captureIds.length === 0) return byCapture;
  const rows = await db.select().from(captureChannels).where(inArray(captureChannels.captureId, captureIds)).orderBy(asc(captureChannels.captureId), asc(captureChannels.position));
  for (const r of rows) {
    const list = byCapture.get(r.captureId) ?? [];
    list.push({ index: r.position, name: r.name, unit: r.unit, minValue: r.minValue, maxValue: r.maxValue, figures: r.figures });
    byCapture.set(r.captureId, list);
  }
  return byCapture;
}

const detailColumns = {
  capture: captures,
  logTitle: bringUpLogs.title,
  ownerId: bringUpLogs.ownerId,
  visibility: bringUpLogs.visibility,
  uploadName: uploads.originalName,
  uploadBytes: uploads.bytes,
  uploadUrl: uploads.url,
  readingValue: readings.value,
  readingEnteredValue: readings.enteredValue,
  readingEnteredUnit: readings.enteredUnit,
  readingVerdict: readings.verdict,
  readingFarOutside: readings.farOutside,
  readingTakenAt: readings.takenAt,
  checkpointId: logCheckpoints.id,
  checkpointName: logCheckpoints.name,
  checkpointMeasure: logCheckpoints.measure,
  checkpointUnit: logCheckpoints.unit,
  checkpointStage: logCheckpoints.stage,
  expectedMin: logCheckpoints.expectedMin,
  expectedMax: logCheckpoints.expectedMax,
};

function detailFrom(row: Awaited<ReturnType<typeof detailQuery>>[number], access: LogAccess, channels: CaptureChannelView[]): CaptureDetail {
  return {
    capture: row.capture,
    access,
    canEdit: access === "owner",
    log: { id: row.capture.logId, title: row.logTitle, ownerId: row.ownerId },
    upload: { name: row.uploadName, bytes: row.uploadBytes, url: row.uploadUrl },
    reading: {
      id: row.capture.readingId,
      value: row.readingValue,
      enteredValue: row.readingEnteredValue,
      enteredUnit: row.readingEnteredUnit,
      verdict: row.readingVerdict,
      farOutside: row.readingFarOutside,
      takenAt: row.readingTakenAt,
    },
    checkpoint: {
      id: row.checkpointId,
      name: row.checkpointName,
      measure: row.checkpointMeasure,
      unit: row.checkpointUnit,
      stage: row.checkpointStage,
      expectedMin: row.expectedMin,
      expectedMax: row.expectedMax,
    },
    channels,
  };
}

function detailQuery(where: ReturnType<typeof eq>) {
  return db
    .select(detailColumns)
    .from(captures)
    .innerJoin(bringUpLogs, eq(bringUpLogs.id, captures.logId))
    .innerJoin(uploads, eq(uploads.key, captures.uploadKey))
    .innerJoin(readings, eq(readings.id, captures.readingId))
    .innerJoin(logCheckpoints, eq(logCheckpoints.id, readings.checkpointId))
    .where(where)
    .orderBy(asc(captures.createdAt), asc(captures.id));
}

/**
 * The capture as this viewer may see it, or null — for a missing capture and for one on a log
 * they may not read alike, so a private log's captures stay hidden. Access is the log's.
 */
export async function captureForViewer(viewer: LogViewer, captureId: string): Promise<CaptureDetail | null> {
  if (!UUID.test(captureId)) return null;
  const [row] = await detailQuery(eq(captures.id, captureId));
  if (!row) return null;
  const access = await accessTo(db, viewer, { id: row.capture.logId, ownerId: row.ownerId, visibility: row.visibility });
  if (access === null) return null;
  const channels = await channelsOf([row.capture.id]);
  return detailFrom(row, access, channels.get(row.capture.id) ?? []);
}

/**
 * Every capture of a log, oldest first. The caller has the viewer's access from
 * getLogForViewer (the log page); it is not decided again here.
 */
export async function capturesOfLog(logId: string, access: LogAccess): Promise<CaptureDetail[]> {
  if (!UUID.test(logId)) return [];
  const rows = await detailQuery(eq(captures.logId, logId));
  const channels = await channelsOf(rows.map((r) => r.capture.id));
  return rows.map((row) => detailFrom(row, access, channels.get(row.capture.id) ?? []));
}

export type RawWindow = {
  /** index of the first sample returned */
  firstIndex: number;
  timeS: Float64Array;
  /** by channel index */
  values: Map<number, Float64Array>;
};

/**
 * The samples of the blocks that overlap [from, to], for the given channels: only those blocks
 * are read. Times come from the stored time series, or from start + i · interval.
 */
export async function readCaptureSamples(capture: Pick<Capture, "id" | "evenlySpaced" | "startTimeS" | "sampleIntervalS">, from: number, to: number, channels: readonly number[]): Promise<RawWindow> {
  const series = capture.evenlySpaced ? [...channels] : [...channels, TIME_SERIES];
  const rows = await db
    .select({ series: captureBlocks.series, block: captureBlocks.block, firstIndex: captureBlocks.firstIndex, sampleCount: captureBlocks.sampleCount, data: captureBlocks.data })
    .from(captureBlocks)
    .where(and(eq(captureBlocks.captureId, capture.id), inArray(captureBlocks.series, series), gte(captureBlocks.lastTimeS, from), lte(captureBlocks.firstTimeS, to)))
    .orderBy(asc(captureBlocks.block), asc(captureBlocks.series));
  const firstIndex = rows[0]?.firstIndex ?? 0;
  const total = rows.filter((r) => r.series === (channels[0] ?? TIME_SERIES)).reduce((n, r) => n + r.sampleCount, 0);
  const timeS = new Float64Array(total);
  const values = new Map(channels.map((c) => [c, new Float64Array(total)] as const));
  for (const r of rows) {
    const offset = r.firstIndex - firstIndex;
    if (r.series === TIME_SERIES) decodeFloat64(r.data, timeS, offset);
    else {
      const into = values.get(r.series);
      if (into) decodeFloat32(r.data, into, offset);
    }
  }
  if (capture.evenlySpaced) {
    const start = capture.startTimeS ?? 0;
    const interval = capture.sampleIntervalS ?? 0;
    for (let i = 0; i < total; i++) timeS[i] = start + (firstIndex + i) * interval;
  }
  return { firstIndex, timeS, values };
}

// ——— Confirming a proposal ———

export type AppliedProposal = RecordedReading & { figureLabel: string; channelName: string };

/**
 * Makes the capture's proposed figure the reading's value, in the checkpoint's unit, and
 * classifies it again. The figure is worked out here from the stored measurement, never taken from
 * the form; the value before is kept on the capture. Only the log's owner, once per capture.
 */
export async function confirmProposal(actor: BenchActor, captureId: string, channel: number): Promise<AppliedProposal> {
  return db.transaction(async (tx) => {
    if (!UUID.test(captureId)) throw new BenchError(404, NO_CAPTURE);
    const [found] = await tx.select({ logId: captures.logId }).from(captures).where(eq(captures.id, captureId));
    if (!found) throw new BenchError(404, NO_CAPTURE);
    await lockOwnLog(tx, actor, found.logId);
    const [capture] = await tx.select().from(captures).where(eq(captures.id, captureId)).for("update");
    if (!capture) throw new BenchError(404, NO_CAPTURE);
    if (capture.state !== "measured") throw new BenchError(409, "The capture is not measured yet; confirm its figure once it is.");
    if (capture.appliedAt) throw new BenchError(409, "This capture's figure is already the reading's value.");

    const [reading] = await tx.select().from(readings).where(eq(readings.id, capture.readingId)).for("update");
    if (!reading) throw new BenchError(404, "The reading of this capture is gone.");
    const [checkpoint] = await tx.select().from(logCheckpoints).where(eq(logCheckpoints.id, reading.checkpointId));
    if (!checkpoint) throw new BenchError(404, "The checkpoint of this reading is gone.");
    const channelRows = await tx.select().from(captureChannels).where(eq(captureChannels.captureId, capture.id)).orderBy(asc(captureChannels.position));
    const proposal = proposeReading(checkpoint, channelRows);
    const option = proposalForChannel(proposal, channel);
    if (!option) {
      const message = proposal.ok ? "That channel has no figure to propose; choose one of those offered." : proposal.reason;
      throw new BenchError(422, message, { channel: [message] });
    }

    const { verdict, farOutside } = classifyReading({ value: option.value, min: checkpoint.expectedMin, max: checkpoint.expectedMax });
    await tx.update(readings).set({ value: option.value, enteredValue: option.value, enteredUnit: checkpoint.unit, verdict, farOutside }).where(eq(readings.id, reading.id));
    await tx
      .update(captures)
      .set({
        appliedAt: new Date(),
        appliedChannel: option.channel,
        appliedFigure: option.figure,
        appliedValue: option.value,
        valueBefore: reading.value,
        enteredValueBefore: reading.enteredValue,
        enteredUnitBefore: reading.enteredUnit,
        updatedAt: new Date(),
      })
      .where(eq(captures.id, capture.id));
    await touchLog(tx, capture.logId);
    return { id: reading.id, value: option.value, unit: checkpoint.unit, verdict, farOutside, figureLabel: option.figureLabel, channelName: option.channelName };
  });
}

// ——— Removing ———

/**
 * Removes a capture its owner no longer wants (the wrong file), with its stored figures and
 * samples and its upload row; returns the stored file's key for the caller to delete from the
 * store after commit. A capture whose figure became the reading's value stays as its evidence.
 */
export async function removeCapture(actor: BenchActor, captureId: string): Promise<{ uploadKey: string; logId: string }> {
  return db.transaction(async (tx) => {
    if (!UUID.test(captureId)) throw new BenchError(404, NO_CAPTURE);
    const [found] = await tx.select({ logId: captures.logId }).from(captures).where(eq(captures.id, captureId));
    if (!found) throw new BenchError(404, NO_CAPTURE);
    await lockOwnLog(tx, actor, found.logId);
    const [capture] = await tx.select().from(captures).where(eq(captures.id, captureId)).for("update");
    if (!capture) throw new BenchError(404, NO_CAPTURE);
    if (capture.appliedAt) throw new BenchError(409, "This capture's figure is the reading's value, so it stays with the reading as its evidence.");
    await tx.delete(captures).where(eq(captures.id, capture.id));
    await deleteUpload({ key: capture.uploadKey, ownerId: actor.id }, tx);
    await touchLog(tx, capture.logId);
    return { uploadKey: capture.uploadKey, logId: capture.logId };
  });
}

// ——— Pins ———

/** The pins this reader of the capture may see, earliest on the trace first. */
export async function pinsFor(captureId: string, viewer: LogViewer, access: LogAccess): Promise<CapturePinView[]> {
  const scope = pinScope(access);
  if (scope === "none" || !viewer) return [];
  const rows = await db
    .select({
      id: capturePins.id,
      sessionId: capturePins.sessionId,
      authorName: users.name,
      timeS: capturePins.timeS,
      channel: capturePins.channel,
      body: capturePins.body,
      createdAt: capturePins.createdAt,
    })
    .from(capturePins)
    .innerJoin(users, eq(users.id, capturePins.authorId))
    .innerJoin(reviewSessions, eq(reviewSessions.id, capturePins.sessionId))
    .where(
      and(
        eq(capturePins.captureId, captureId),
        scope === "own-sessions" ? and(eq(reviewSessions.reviewerId, viewer.id), inArray(reviewSessions.state, [...REVIEWER_READ_STATES])) : undefined,
      ),
    )
    .orderBy(asc(capturePins.timeS), asc(capturePins.createdAt));
  return rows.map((r) => ({ ...r, authorName: r.authorName ?? "The reviewer", createdAt: r.createdAt.toISOString() }));
}

/**
 * A comment pinned to a time on the capture by the reviewer of a session on the capture's log,
 * while that session is accepted or delivered. The time must lie on the trace.
 */
export async function addPin(actor: BenchActor, sessionId: string, input: PinInput): Promise<{ id: string }> {
  return db.transaction(async (tx) => {
    const [session] = UUID.test(sessionId)
      ? await tx.select({ reviewerId: reviewSessions.reviewerId, logId: reviewSessions.logId, state: reviewSessions.state }).from(reviewSessions).where(eq(reviewSessions.id, sessionId)).for("share")
      : [];
    const [capture] = await tx
      .select({ id: captures.id, logId: captures.logId, state: captures.state, startTimeS: captures.startTimeS, endTimeS: captures.endTimeS })
      .from(captures)
      .where(eq(captures.id, input.captureId));
    if (!capture) throw new BenchError(404, NO_CAPTURE);
    const decision = decidePin({ actorId: actor.id, session: session ?? null, captureLogId: capture.logId });
    if (!decision.ok) throw new BenchError(decision.status, decision.message);
    if (capture.state !== "measured" || capture.startTimeS === null || capture.endTimeS === null) {
      throw new BenchError(409, "The capture is not measured yet, so it has no trace to pin to.");
    }
    if (input.time < capture.startTimeS || input.time > capture.endTimeS) {
      const message = "That time is outside the capture; choose one on the trace.";
      throw new BenchError(422, message, { time: [message] });
    }
    if (input.channel !== null) {
      const [channels] = await tx.select({ n: count() }).from(captureChannels).where(eq(captureChannels.captureId, capture.id));
      if (input.channel >= (channels?.n ?? 0)) throw new BenchError(422, "The capture has no such channel.", { channel: ["Choose one of the capture's channels, or none."] });
    }
    const [row] = await tx
      .insert(capturePins)
      .values({ captureId: capture.id, sessionId, authorId: actor.id, timeS: input.time, channel: input.channel, body: input.body })
      .returning({ id: capturePins.id });
    if (!row) throw new Error("inserting a pin returned no row");
    return row;
  });
}
