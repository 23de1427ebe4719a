// Attaching a capture to a reading and measuring it against the real PostgreSQL: inline for a
// small file, through the worker's job handler (with its progress) for a big one, the parser's
// message for a bad file, the sweep for a stranded one; then the proposal the builder confirms.
// Expected figures follow from the generator's parameters and the IEEE Std 181 definitions
// (frequency = 1 / period between 50 % crossings, duty = pulse duration / period, 10–90 %
// transition duration = 0.8 of a linear ramp, state levels = the two flat parts).
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { captureCsv, pulseTrain, transitionDuration1090 } from "../../support/captures";
import { BUILDER, logWithReadings, MODERATOR, progressSeen, startWorld, STRANGER, uploadCapture, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

let world: World;
type Captures = typeof import("@/db/queries/captures");
let captures: Captures;
let measure: typeof import("@/lib/captures/measure");

// A two-transistor forward converter's gate drive: tens of kHz, below 50 % duty (common practice).
const GATE = { sampleRateHz: 25e6, frequencyHz: 40e3, dutyCyclePct: 44, lowV: 0, highV: 15, riseRampS: 400e-9, fallRampS: 300e-9, noiseRmsV: 0.05, seed: 7 };

function gateCsv(samples: number): string {
  const ch1 = pulseTrain({ ...GATE, samples });
  const ch2 = pulseTrain({ ...GATE, samples, highV: 12, seed: 8 });
  return captureCsv(ch1.timeS, [
    { name: "CH1", unit: "V", values: ch1.values },
    { name: "CH2", unit: "V", values: ch2.values },
  ], { metadata: ["Instrument,Bench scope"] });
}

async function row(id: string) {
  const { rows } = await world.pool.query("select * from captures where id = $1", [id]);
  return rows[0];
}

beforeAll(async () => {
  world = await startWorld("captures_measure");
  captures = await import("@/db/queries/captures");
  measure = await import("@/lib/captures/measure");
});

afterAll(async () => {
  await world?.close();
});

describe("a small capture, measured inline", () => {
  it("is attached to the builder's reading, measured, and its figures and samples stored per channel", async () => {
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 36, unit: "kHz" }]);
    const key = await uploadCapture(world, BUILDER.id, gateCsv(6000), "gate.csv");
    const { id, bytes } = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive frequency"]!, uploadKey: key });
    expect(bytes).toBeLessThan(measure.INLINE_MEASURE_BYTES);
    expect(await row(id)).toMatchObject({ state: "queued", progress: 0 });

    expect(await measure.measureCapture(id)).toBe("measured");
    // A second attempt finds nothing to take.
    expect(await measure.measureCapture(id)).toBe("not-claimed");
    expect(await row(id)).toMatchObject({ state: "measured", progress: 100, sample_count: 6000, evenly_spaced: true, error_message: null });

    const detail = await captures.captureForViewer(BUILDER, id);
    expect(detail?.channels.map((c) => [c.name, c.unit])).toEqual([["CH1", "V"], ["CH2", "V"]]);
    const ch1 = detail!.channels[0]!.figures;
    expect(ch1.frequencyHz! / 40e3).toBeCloseTo(1, 3);
    expect(ch1.dutyCyclePct!).toBeCloseTo(44, 0);
    expect(ch1.highV!).toBeCloseTo(15, 1);
    expect(ch1.lowV!).toBeCloseTo(0, 1);
    expect(ch1.riseTimeS! / transitionDuration1090(400e-9)).toBeCloseTo(1, 0);
    expect(detail!.channels[1]!.figures.highV!).toBeCloseTo(12, 1);

    // The samples are kept in blocks (one a channel here), so the window route never reads the CSV again.
    const { rows: blocks } = await world.pool.query("select series, sample_count, octet_length(data) as bytes from capture_blocks where capture_id = $1 order by series", [id]);
    expect(blocks).toEqual([{ series: 0, sample_count: 6000, bytes: 24_000 }, { series: 1, sample_count: 6000, bytes: 24_000 }]);
    // The original stays as uploaded.
    expect((await world.pool.query("select bytes from uploads where key = $1", [key])).rows[0].bytes).toBe(bytes);
  });

  it("refuses a file that is not the builder's, a reading of another log, and anyone but the owner", async () => {
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 40, unit: "kHz" }]);
    const other = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive duty cycle", value: 44, unit: "%" }]);
    const readingId = readingIds["Gate-drive frequency"]!;
    const strangersFile = await uploadCapture(world, STRANGER.id, gateCsv(500));
    await expect(captures.attachCapture(BUILDER, logId, { readingId, uploadKey: strangersFile })).rejects.toMatchObject({ status: 403 });
    const mine = await uploadCapture(world, BUILDER.id, gateCsv(500));
    await expect(captures.attachCapture(BUILDER, logId, { readingId: other.readingIds["Gate-drive duty cycle"]!, uploadKey: mine })).rejects.toMatchObject({ status: 404 });
    // A private log: a stranger is told it does not exist, a moderator (who may read it) that it is not theirs.
    await expect(captures.attachCapture(STRANGER, logId, { readingId, uploadKey: mine })).rejects.toMatchObject({ status: 404 });
    await expect(captures.attachCapture(MODERATOR, logId, { readingId, uploadKey: mine })).rejects.toMatchObject({ status: 403 });
    // Nothing was written by the refusals; the same file attaches once only.
    expect((await world.pool.query("select count(*)::int as n from captures where upload_key = $1", [mine])).rows[0].n).toBe(0);
    await captures.attachCapture(BUILDER, logId, { readingId, uploadKey: mine });
    await expect(captures.attachCapture(BUILDER, logId, { readingId, uploadKey: mine })).rejects.toMatchObject({ status: 409 });
  });

  it("ends a bad file as failed with the parser's message naming the line", async () => {
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 40, unit: "kHz" }]);
    const key = await uploadCapture(world, BUILDER.id, "Time (s),CH1 (V)\n0,0\n1e-7,15\n2e-7,fifteen\n3e-7,0\n", "broken.csv");
    const { id } = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive frequency"]!, uploadKey: key });
    expect(await measure.measureCapture(id)).toBe("failed");
    const failed = await row(id);
    expect(failed.state).toBe("failed");
    expect(failed.error_message).toMatch(/Line 4\b/);
    expect(failed.error_message).toMatch(/fifteen/);
    const { captureStatusView } = await import("@/lib/captures/status-view");
    const status = captureStatusView((await captures.captureForViewer(BUILDER, id))!);
    expect(status).toMatchObject({ state: "failed", error: failed.error_message, proposal: null, channels: [] });
  });
});

describe("a big capture, measured by the worker's job", () => {
  it("reports its progress on the capture row from queued to measured", async () => {
    const { JOB_HANDLERS } = await import("@/lib/jobs/handlers");
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive duty cycle", value: 50, unit: "%" }]);
    const key = await uploadCapture(world, BUILDER.id, gateCsv(80_000), "long-gate.csv");
    const { id, bytes } = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive duty cycle"]!, uploadKey: key });
    expect(bytes).toBeGreaterThan(measure.INLINE_MEASURE_BYTES);

    await JOB_HANDLERS["capture-measure"]!({ captureId: id });
    const seen = await progressSeen(world, id);
    expect(seen[0]).toEqual({ state: "measuring", progress: 1 });
    expect(seen.at(-1)).toEqual({ state: "measured", progress: 100 });
    const during = seen.filter((s) => s.state === "measuring").map((s) => s.progress);
    // Several steps in between, never going back.
    expect(new Set(during).size).toBeGreaterThanOrEqual(4);
    expect(during).toEqual([...during].sort((a, b) => a - b));
    const { rows } = await world.pool.query("select count(*)::int as n, sum(sample_count)::int as samples from capture_blocks where capture_id = $1 and series = 0", [id]);
    // 80 000 samples in blocks of 65 536.
    expect(rows[0]).toEqual({ n: 2, samples: 80_000 });
  });

  it("gives a capture back to the queue when the store does not answer, for pg-boss to retry", async () => {
    const { JOB_HANDLERS } = await import("@/lib/jobs/handlers");
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive duty cycle", value: 50, unit: "%" }]);
    const key = await uploadCapture(world, BUILDER.id, gateCsv(500));
    await world.pool.query("update uploads set url = $2 where key = $1", [key, `${world.storeUrl}/f/missing-${key}`]);
    const { id } = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive duty cycle"]!, uploadKey: key });
    await expect(JOB_HANDLERS["capture-measure"]!({ captureId: id })).rejects.toThrow(/retrying/);
    expect(await row(id)).toMatchObject({ state: "queued", progress: 0 });
  });

  it("is picked up by the sweep when its job was never queued, and measured once when two take it at once", async () => {
    const { JOB_HANDLERS } = await import("@/lib/jobs/handlers");
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive duty cycle", value: 50, unit: "%" }]);
    const stranded = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive duty cycle"]!, uploadKey: await uploadCapture(world, BUILDER.id, gateCsv(800)) });
    await world.pool.query("update captures set updated_at = now() - interval '2 minutes' where id = $1", [stranded.id]);
    await JOB_HANDLERS["captures-sweep"]!({});
    expect(await row(stranded.id)).toMatchObject({ state: "measured" });

    const twice = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive duty cycle"]!, uploadKey: await uploadCapture(world, BUILDER.id, gateCsv(800)) });
    const outcomes = await Promise.all([measure.measureCapture(twice.id), measure.measureCapture(twice.id)]);
    expect(outcomes.sort()).toEqual(["measured", "not-claimed"]);
  });
});

describe("the proposed value", () => {
  it("is the measured frequency in the checkpoint's kHz; confirming it re-classifies the reading once", async () => {
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 36, unit: "kHz" }]);
    const readingId = readingIds["Gate-drive frequency"]!;
    const { id } = await captures.attachCapture(BUILDER, logId, { readingId, uploadKey: await uploadCapture(world, BUILDER.id, gateCsv(6000)) });
    await measure.measureCapture(id);
    const { captureStatusView } = await import("@/lib/captures/status-view");
    const status = captureStatusView((await captures.captureForViewer(BUILDER, id))!);
    expect(status.proposal).toMatchObject({ ok: true, figure: "frequencyHz" });
    if (!status.proposal?.ok) throw new Error("no proposal");
    const [first, second] = status.proposal.options;
    // Hz → kHz is ÷ 10³ (SI Brochure, 9th ed., table 7).
    expect(first!.value).toBeCloseTo(first!.measured / 1000, 9);
    expect(first!.value).toBeCloseTo(40, 1);
    expect(second!.channelName).toBe("CH2");

    // 36 kHz was low against 38–42 kHz; nothing changed before confirming.
    expect((await world.pool.query("select value, verdict from readings where id = $1", [readingId])).rows[0]).toEqual({ value: 36, verdict: "low" });
    await expect(captures.confirmProposal(STRANGER, id, 0)).rejects.toMatchObject({ status: 404 });
    await expect(captures.confirmProposal(MODERATOR, id, 0)).rejects.toMatchObject({ status: 403 });
    await expect(captures.confirmProposal(BUILDER, id, 7)).rejects.toMatchObject({ status: 422 });

    const applied = await captures.confirmProposal(BUILDER, id, 0);
    expect(applied).toMatchObject({ id: readingId, unit: "kHz", verdict: "within", farOutside: false, channelName: "CH1" });
    expect((await world.pool.query("select value, entered_value, entered_unit, verdict from readings where id = $1", [readingId])).rows[0]).toEqual({
      value: first!.value,
      entered_value: first!.value,
      entered_unit: "kHz",
      verdict: "within",
    });
    expect(await row(id)).toMatchObject({ applied_channel: 0, applied_figure: "frequencyHz", value_before: 36, entered_unit_before: "kHz" });
    await expect(captures.confirmProposal(BUILDER, id, 1)).rejects.toMatchObject({ status: 409 });
    // The capture is the reading's evidence now.
    await expect(captures.removeCapture(BUILDER, id)).rejects.toMatchObject({ status: 409 });
  });

  it("is the duty cycle in % for the duty checkpoint, and a capture without one proposes nothing", async () => {
    const { logId, readingIds } = await logWithReadings(BUILDER.id, [
      { checkpoint: "Gate-drive duty cycle", value: 52, unit: "%" },
      { checkpoint: "Primary heatsink temperature", value: 40, unit: "°C" },
    ]);
    const { captureStatusView } = await import("@/lib/captures/status-view");
    const duty = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Gate-drive duty cycle"]!, uploadKey: await uploadCapture(world, BUILDER.id, gateCsv(6000)) });
    await measure.measureCapture(duty.id);
    const dutyStatus = captureStatusView((await captures.captureForViewer(BUILDER, duty.id))!);
    expect(dutyStatus.proposal?.ok && dutyStatus.proposal.options[0]!.value).toBeCloseTo(44, 0);
    expect((await captures.confirmProposal(BUILDER, duty.id, 0)).verdict).toBe("within");

    const heat = await captures.attachCapture(BUILDER, logId, { readingId: readingIds["Primary heatsink temperature"]!, uploadKey: await uploadCapture(world, BUILDER.id, gateCsv(600)) });
    await measure.measureCapture(heat.id);
    const heatStatus = captureStatusView((await captures.captureForViewer(BUILDER, heat.id))!);
    expect(heatStatus.proposal).toMatchObject({ ok: false, figure: null });
    await expect(captures.confirmProposal(BUILDER, heat.id, 0)).rejects.toMatchObject({ status: 422 });
    // Not the reading's value, so the builder may remove it; its upload row goes with it.
    const removed = await captures.removeCapture(BUILDER, heat.id);
    expect((await world.pool.query("select count(*)::int as n from uploads where key = $1", [removed.uploadKey])).rows[0].n).toBe(0);
    expect((await world.pool.query("select count(*)::int as n from capture_blocks where capture_id = $1", [heat.id])).rows[0].n).toBe(0);
  });
});
