// Scope captures on the demo's bring-up logs, one in each state: measured (log 1's gate drive at the
// 40.1 kHz and 46 % its readings say, two channels, with the reviewer's pins from the delivered
// session), failed (a file whose time column starts again part-way down, with the parser's own
// message), and queued and measuring on the second board. The figures and sample blocks are the
// app's own (parseCaptureCsv, measurePulses, storableFigures, encodeBlocks, as lib/captures/measure.ts
// runs them), so the viewer shows real measurements and proposes the reading's value from them.
//
// The files are site-relative (/demo/*.csv, in public/), which the browser downloads but the worker
// cannot fetch. The worker's sweep (strandedCaptureIds) takes queued captures untouched for a
// minute and measuring ones for ten; it would put these back in the queue every minute with an
// error line. So the waiting two carry an updated_at ahead of the clock, out of the sweep's reach:
// they stay waiting, and `npm start` stays quiet.
import { eq, sql } from "drizzle-orm";
import { encodeBlocks, spacingOf } from "@/lib/captures/blocks";
import { storableFigures } from "@/lib/captures/figures";
import { decidePin } from "@/lib/captures/pin-rules";
import { EngineeringInputError, measurePulses, parseCaptureCsv } from "@/lib/engineering";
import * as schema from "./schema";
import { DEMO_REVIEWER } from "./seed-data";
import { DEMO_LOGS, logId, readingId } from "./seed-bench";
import { appendedRecords, firstBoardEdges, firstBoardGateDrive, secondBoardGateDrive, secondBoardLongRecord, type DemoCaptureFile } from "./seed-capture-files";
import { sessionId } from "./seed-reviews";
import { demoUuid, type DemoClock, type SeedTx } from "./seed-support";

type PinSpec = { session: number; timeS: number; channel: number | null; body: string };

type CaptureSpec = {
  n: number;
  log: number;
  /** the capture is on the log's first reading of this checkpoint */
  checkpoint: string;
  make: () => DemoCaptureFile;
  state: schema.CaptureState;
  /** measured and failed ones were attached minutes after their reading; the waiting ones just now */
  attached: { afterReadingMin: number } | { minutesAgo: number };
  /** where a measuring one has got to (lib/captures/measure.ts: 45 % once parsed) */
  progress?: number;
  pins?: PinSpec[];
};

function demoCaptures(): CaptureSpec[] {
  const edges = firstBoardEdges();
  return [
    {
      n: 1,
      log: 1,
      checkpoint: "Gate-drive frequency",
      make: firstBoardGateDrive,
      state: "measured",
      attached: { afterReadingMin: 3 },
      pins: [
        { session: 3, timeS: edges.q1RiseS, channel: 0, body: "A clean rising edge: about 0.24 µs from 10 % to 90 %, with no overshoot to speak of. The gate resistor suits these transistors." },
        {
          session: 3,
          timeS: (edges.q1FallS + edges.q2RiseS) / 2,
          channel: null,
          body: "About 1 µs of dead time between Q1 turning off and Q2 turning on: enough margin against shoot-through. Keep it when you change the timing capacitor.",
        },
      ],
    },
    { n: 2, log: 1, checkpoint: "Gate-drive duty cycle", make: appendedRecords, state: "failed", attached: { afterReadingMin: 5 } },
    { n: 3, log: 2, checkpoint: "Gate-drive frequency", make: secondBoardGateDrive, state: "queued", attached: { minutesAgo: 3 } },
    { n: 4, log: 2, checkpoint: "Gate-drive duty cycle", make: secondBoardLongRecord, state: "measuring", attached: { minutesAgo: 6 }, progress: 45 },
  ];
}

export const captureId = (n: number) => demoUuid("capture", n);

const MINUTE_MS = 60_000;

function rangeOf(values: Float64Array): { minValue: number; maxValue: number } {
  let minValue = Infinity;
  let maxValue = -Infinity;
  for (const v of values) {
    if (v < minValue) minValue = v;
    if (v > maxValue) maxValue = v;
  }
  return Number.isFinite(minValue) ? { minValue, maxValue } : { minValue: 0, maxValue: 0 };
}

/** What measureText (lib/captures/measure.ts) stores for a capture's text. */
function measure(text: string) {
  const parsed = parseCaptureCsv(text);
  const channels = parsed.channels.map((c) => ({
    name: c.name,
    unit: c.unit ?? null,
    ...rangeOf(c.values),
    figures: storableFigures(measurePulses({ timeS: parsed.timeS, values: c.values })),
  }));
  const spacing = spacingOf(parsed.timeS);
  const n = parsed.timeS.length;
  const startTimeS = parsed.timeS[0] ?? 0;
  return {
    sampleCount: n,
    startTimeS,
    endTimeS: parsed.timeS[n - 1] ?? startTimeS,
    sampleIntervalS: spacing.evenly ? spacing.intervalS : parsed.sampleIntervalS,
    evenlySpaced: spacing.evenly,
    channels,
    blocks: encodeBlocks(parsed.timeS, parsed.channels, spacing),
  };
}

/** The parser's message for a file it refuses, as measureCapture stores it. */
function parserMessage(file: DemoCaptureFile): string {
  try {
    parseCaptureCsv(file.text);
  } catch (error) {
    if (error instanceof EngineeringInputError) return error.message;
    throw error;
  }
  throw new Error(`demo capture ${file.file} is meant to fail, but it parses`);
}

/** When the reading the capture is on was taken, as the bench seed stored it. */
async function readingOf(tx: SeedTx, spec: CaptureSpec): Promise<{ id: string; takenAt: Date }> {
  const log = DEMO_LOGS.find((l) => l.n === spec.log)!;
  const index = log.readings.findIndex((r) => r.checkpoint === spec.checkpoint);
  if (index === -1) throw new Error(`demo log ${spec.log} has no reading of “${spec.checkpoint}”`);
  const [reading] = await tx.select({ id: schema.readings.id, takenAt: schema.readings.takenAt }).from(schema.readings).where(eq(schema.readings.id, readingId(spec.log, index)));
  if (!reading) throw new Error(`demo reading ${spec.log}/${index} is missing`);
  return reading;
}

/** Inserts the demo captures that are missing, with their upload rows, figures, sample blocks and pins; returns how many. */
export async function seedCaptures(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const spec of demoCaptures()) {
    const log = DEMO_LOGS.find((l) => l.n === spec.log)!;
    const file = spec.make();
    const reading = await readingOf(tx, spec);
    const createdAt =
      "afterReadingMin" in spec.attached ? new Date(reading.takenAt.getTime() + spec.attached.afterReadingMin * MINUTE_MS) : new Date(clock.now.getTime() - spec.attached.minutesAgo * MINUTE_MS);
    const id = captureId(spec.n);
    const uploadKey = `demo-capture-${spec.n}`;
    await tx
      .insert(schema.uploads)
      .values({
        key: uploadKey,
        ownerId: log.ownerId,
        purpose: "capture",
        originalName: file.file,
        contentType: "text/csv",
        bytes: Buffer.byteLength(file.text),
        url: `/demo/${file.file}`,
        createdAt: new Date(createdAt.getTime() - 20_000),
      })
      .onConflictDoNothing();

    const base = { id, logId: logId(spec.log), readingId: reading.id, uploadKey, createdAt };
    let values: typeof schema.captures.$inferInsert;
    let measured: ReturnType<typeof measure> | null = null;
    switch (spec.state) {
      case "measured": {
        measured = measure(file.text);
        const { channels: _channels, blocks: _blocks, ...facts } = measured;
        const measuredAt = new Date(createdAt.getTime() + 2_000);
        values = { ...base, state: "measured", progress: 100, ...facts, measuredAt, updatedAt: measuredAt };
        break;
      }
      case "failed":
        // Read back (20 %), then refused by the parser before any channel was measured.
        values = { ...base, state: "failed", progress: 20, errorMessage: parserMessage(file), updatedAt: new Date(createdAt.getTime() + 1_000) };
        break;
      case "queued":
      case "measuring":
        values = { ...base, state: spec.state, progress: spec.progress ?? 0, updatedAt: clock.ahead(10 * 365) };
        break;
    }
    const rows = await tx.insert(schema.captures).values(values).onConflictDoNothing().returning({ id: schema.captures.id });
    if (rows.length === 0) continue;
    inserted += 1;

    if (measured) {
      await tx.insert(schema.captureChannels).values(measured.channels.map((c, position) => ({ captureId: id, position, ...c })));
      await tx.insert(schema.captureBlocks).values(measured.blocks.map((b) => ({ captureId: id, ...b })));
    }
    for (const [i, pin] of (spec.pins ?? []).entries()) {
      const [session] = await tx
        .select({ reviewerId: schema.reviewSessions.reviewerId, logId: schema.reviewSessions.logId, state: schema.reviewSessions.state, acceptedAt: schema.reviewSessions.acceptedAt, deliveredAt: schema.reviewSessions.deliveredAt })
        .from(schema.reviewSessions)
        .where(eq(schema.reviewSessions.id, sessionId(pin.session)));
      // The product's own rule for who pins where, and a time on the trace.
      const decision = decidePin({ actorId: DEMO_REVIEWER.userId, session: session ?? null, captureLogId: base.logId });
      if (!decision.ok) throw new Error(`demo pin ${spec.n}/${i}: ${decision.message}`);
      if (!measured || pin.timeS < measured.startTimeS || pin.timeS > measured.endTimeS) throw new Error(`demo pin ${spec.n}/${i} is not on the trace`);
      if (pin.channel !== null && pin.channel >= measured.channels.length) throw new Error(`demo pin ${spec.n}/${i} names a channel the capture lacks`);
      // Pinned while the report was being written: between accepting and delivering.
      const from = session!.acceptedAt ?? createdAt;
      const to = session!.deliveredAt ?? clock.now;
      const at = new Date(from.getTime() + ((i + 1) / (spec.pins!.length + 1)) * (to.getTime() - from.getTime()));
      await tx.insert(schema.capturePins).values({
        id: demoUuid("capture-pin", spec.n * 100 + i),
        captureId: id,
        sessionId: sessionId(pin.session),
        authorId: DEMO_REVIEWER.userId,
        timeS: pin.timeS,
        channel: pin.channel,
        body: pin.body,
        createdAt: at,
      });
    }
    // Attaching a capture touches its log (db/queries/captures.ts), so the log list shows it moved.
    await tx
      .update(schema.bringUpLogs)
      .set({ updatedAt: sql`greatest(${schema.bringUpLogs.updatedAt}, ${createdAt.toISOString()}::timestamptz)` })
      .where(eq(schema.bringUpLogs.id, base.logId));
  }
  return inserted;
}
