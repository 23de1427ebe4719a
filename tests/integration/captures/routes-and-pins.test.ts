// The capture routes and reviewer pins against the real PostgreSQL, through the real guard with
// only the session replaced: the window route returns at most `points` per channel and covers
// the window it was asked for, 422 on bad parameters, and the same 404 for a capture the viewer
// may not read as for a missing one; pins are the session reviewer's alone, and each reader sees
// the pins the log-access rules give them.
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { captureCsv, pulseTrain } from "../../support/captures";
import { BUILDER, logWithReadings, MODERATOR, OTHER_REVIEWER, REVIEWER, reviewSession, startWorld, STRANGER, uploadCapture, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/config", () => ({ auth: async () => (session.userId ? { user: { id: session.userId } } : null) }));

let world: World;
let captures: typeof import("@/db/queries/captures");
let windowRoute: typeof import("@/app/api/captures/[id]/window/route");
let statusRoute: typeof import("@/app/api/captures/[id]/route");

const SAMPLE_RATE = 20e6;
const SAMPLES = 10_000;
let logId: string;
let captureId: string;
let publicCaptureId: string;
let unmeasuredId: string;
let sessionId: string;

function csv(samples: number, uneven = false): string {
  const ch1 = pulseTrain({ sampleRateHz: SAMPLE_RATE, samples, frequencyHz: 20e3, dutyCyclePct: 40, lowV: 0, highV: 15, riseRampS: 300e-9, fallRampS: 300e-9, noiseRmsV: 0.02, seed: 1 });
  const ch2 = pulseTrain({ sampleRateHz: SAMPLE_RATE, samples, frequencyHz: 20e3, dutyCyclePct: 40, lowV: 0, highV: 12, riseRampS: 300e-9, fallRampS: 300e-9, noiseRmsV: 0.02, seed: 2 });
  // Uneven: every other sample a third of a step late, as a resampled export can be.
  const times = uneven ? ch1.timeS.map((t, i) => t + (i % 2) * (1 / SAMPLE_RATE / 3)) : ch1.timeS;
  return captureCsv(times, [
    { name: "CH1", unit: "V", values: ch1.values },
    { name: "CH2", unit: "V", values: ch2.values },
  ]);
}

function get(path: string): Request {
  return new Request(`http://localhost${path}`);
}

async function windowOf(id: string, query: string) {
  const response = await windowRoute.GET(get(`/api/captures/${id}/window?${query}`), { params: Promise.resolve({ id }) });
  return { status: response.status, body: await response.json() };
}

async function statusOf(id: string) {
  const response = await statusRoute.GET(get(`/api/captures/${id}`), { params: Promise.resolve({ id }) });
  return { status: response.status, body: await response.json() };
}

async function measured(log: string, readingId: string, text: string): Promise<string> {
  const measure = await import("@/lib/captures/measure");
  const { id } = await captures.attachCapture(BUILDER, log, { readingId, uploadKey: await uploadCapture(world, BUILDER.id, text) });
  expect(await measure.measureCapture(id)).toBe("measured");
  return id;
}

beforeAll(async () => {
  world = await startWorld("captures_routes");
  captures = await import("@/db/queries/captures");
  windowRoute = await import("@/app/api/captures/[id]/window/route");
  statusRoute = await import("@/app/api/captures/[id]/route");
  const log = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 20, unit: "kHz" }]);
  logId = log.logId;
  captureId = await measured(logId, log.readingIds["Gate-drive frequency"]!, csv(SAMPLES));
  const unmeasured = await captures.attachCapture(BUILDER, logId, { readingId: log.readingIds["Gate-drive frequency"]!, uploadKey: await uploadCapture(world, BUILDER.id, csv(200)) });
  unmeasuredId = unmeasured.id;
  const open = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive duty cycle", value: 40, unit: "%" }], "public");
  publicCaptureId = await measured(open.logId, open.readingIds["Gate-drive duty cycle"]!, csv(4000, true));
  sessionId = await reviewSession(world, logId, REVIEWER.id, "accepted");
});

afterAll(async () => {
  await world?.close();
});

beforeEach(() => {
  session.userId = null;
});

describe("GET /api/captures/[id]/window", () => {
  it("downsamples the whole capture to at most `points` per channel, keeping both ends", async () => {
    session.userId = BUILDER.id;
    const { status, body } = await windowOf(captureId, "points=500");
    expect(status).toBe(200);
    const last = (SAMPLES - 1) / SAMPLE_RATE;
    expect(body).toMatchObject({ from: 0, points: 500, samplesInWindow: SAMPLES });
    expect(body.to).toBeCloseTo(last, 12);
    expect(body.traces.map((t: { name: string }) => t.name)).toEqual(["CH1", "CH2"]);
    for (const trace of body.traces) {
      // LTTB (Steinarsson 2013): exactly the target count, the first and last samples kept.
      expect(trace.timeS).toHaveLength(500);
      expect(trace.values).toHaveLength(500);
      expect(trace.timeS[0]).toBe(0);
      expect(trace.timeS.at(-1)).toBeCloseTo(last, 12);
    }
  });

  it("reads a zoomed window at full resolution when it holds fewer samples than points, and covers it", async () => {
    session.userId = BUILDER.id;
    // 25 µs at 20 MS/s (50 ns a sample) holds samples 2001 to 2500: 500, fewer than 1200 points, so
    // every sample comes back, with one beyond each edge. The edges sit between samples on purpose.
    const from = 100.02e-6;
    const to = 125.02e-6;
    const { status, body } = await windowOf(captureId, `from=${from}&to=${to}&points=1200&channel=1`);
    expect(status).toBe(200);
    expect(body.traces).toHaveLength(1);
    const [trace] = body.traces;
    expect(trace).toMatchObject({ index: 1, name: "CH2" });
    expect(body.samplesInWindow).toBe(500);
    expect(trace.timeS).toHaveLength(502);
    expect(trace.timeS.length).toBeLessThanOrEqual(1200);
    expect(trace.timeS[0]).toBeLessThanOrEqual(from);
    expect(trace.timeS.at(-1)).toBeGreaterThanOrEqual(to);
    // Consecutive samples one sample interval apart: nothing skipped.
    const steps = trace.timeS.slice(1).map((t: number, i: number) => t - trace.timeS[i]);
    for (const step of steps) expect(step).toBeCloseTo(1 / SAMPLE_RATE, 12);
    // The levels come back as stored (Float32) values of the 12 V channel.
    expect(Math.max(...trace.values)).toBeGreaterThan(11.8);

    // Fewer points than samples in the window: exactly that many, still covering it.
    const coarse = await windowOf(captureId, `from=${from}&to=${to}&points=50`);
    for (const t of coarse.body.traces) {
      expect(t.timeS).toHaveLength(50);
      expect(t.timeS[0]).toBeLessThanOrEqual(from);
      expect(t.timeS.at(-1)).toBeGreaterThanOrEqual(to);
    }
  });

  it("reads uneven sample times from their own stored series", async () => {
    const { status, body } = await windowOf(publicCaptureId, "from=50e-6&to=60e-6&points=2000");
    expect(status).toBe(200);
    const [trace] = body.traces;
    expect(trace.timeS[0]).toBeLessThanOrEqual(50e-6);
    expect(trace.timeS.at(-1)).toBeGreaterThanOrEqual(60e-6);
    // The two alternating steps, 2/3 and 4/3 of the nominal interval.
    const steps = new Set(trace.timeS.slice(1).map((t: number, i: number) => Math.round(((t - trace.timeS[i]) * SAMPLE_RATE * 3))));
    expect([...steps].sort()).toEqual([2, 4]);
  });

  it("answers 422 with field errors on bad parameters and a window outside the capture", async () => {
    session.userId = BUILDER.id;
    expect(await windowOf(captureId, "points=1")).toMatchObject({ status: 422, body: { error: "invalid_input", fieldErrors: { points: [expect.any(String)] } } });
    expect(await windowOf(captureId, "from=abc&to=1")).toMatchObject({ status: 422, body: { fieldErrors: { from: [expect.any(String)] } } });
    expect(await windowOf(captureId, "from=2e-4&to=1e-4")).toMatchObject({ status: 422, body: { fieldErrors: { to: [expect.any(String)] } } });
    expect(await windowOf(captureId, "from=0&to=1&scale=log")).toMatchObject({ status: 422 });
    expect(await windowOf(captureId, "channel=2")).toMatchObject({ status: 422, body: { fieldErrors: { channel: [expect.any(String)] } } });
    expect(await windowOf(captureId, "from=1&to=2")).toMatchObject({ status: 422, body: { fieldErrors: { from: [expect.any(String)] } } });
    expect(await windowOf(unmeasuredId, "")).toMatchObject({ status: 409 });
  });

  it("is the owner's, the accepted reviewer's and a moderator's for a private log; 404 for anyone else, signed in or not", async () => {
    for (const id of [BUILDER.id, REVIEWER.id, MODERATOR.id]) {
      session.userId = id;
      expect((await windowOf(captureId, "points=10")).status).toBe(200);
    }
    for (const id of [STRANGER.id, OTHER_REVIEWER.id, null]) {
      session.userId = id;
      const answer = await windowOf(captureId, "points=10");
      expect(answer).toEqual({ status: 404, body: { error: "not_found", message: "There is no such capture, or it is not shared with you." } });
      // The same answer as for a capture that does not exist.
      expect(await windowOf("00000000-0000-4000-8000-000000000000", "points=10")).toEqual(answer);
      expect((await statusOf(captureId)).status).toBe(404);
    }
    // A public log's captures are readable by a visitor.
    session.userId = null;
    expect((await windowOf(publicCaptureId, "points=10")).status).toBe(200);
  });
});

describe("GET /api/captures/[id]", () => {
  it("gives the owner the state, figures and proposal; the owner alone may confirm", async () => {
    session.userId = BUILDER.id;
    const { status, body } = await statusOf(captureId);
    expect(status).toBe(200);
    expect(body).toMatchObject({ id: captureId, state: "measured", progress: 100, error: null, sampleCount: SAMPLES, canEdit: true, proposal: { ok: true, figure: "frequencyHz" } });
    expect(body.proposal.options[0].value).toBeCloseTo(20, 1);
    session.userId = REVIEWER.id;
    expect((await statusOf(captureId)).body).toMatchObject({ canEdit: false, state: "measured" });
    session.userId = BUILDER.id;
    expect((await statusOf(unmeasuredId)).body).toMatchObject({ state: "queued", progress: 0, proposal: null });
  });
});

describe("pins", () => {
  const pin = (over: Partial<{ time: number; channel: number | null; body: string }> = {}) => ({
    captureId,
    time: 62.5e-6,
    channel: 0 as number | null,
    body: "The falling edge rings for about half a microsecond here; <b>check</b> the gate resistor.",
    ...over,
  });

  it("are added by the session's reviewer only, at a time on the trace", async () => {
    const { id } = await captures.addPin(REVIEWER, sessionId, pin());
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
    await expect(captures.addPin(BUILDER, sessionId, pin())).rejects.toMatchObject({ status: 404 });
    await expect(captures.addPin(MODERATOR, sessionId, pin())).rejects.toMatchObject({ status: 404 });
    await expect(captures.addPin(OTHER_REVIEWER, sessionId, pin())).rejects.toMatchObject({ status: 404 });
    await expect(captures.addPin(REVIEWER, sessionId, pin({ time: 1 }))).rejects.toMatchObject({ status: 422, fieldErrors: { time: [expect.any(String)] } });
    await expect(captures.addPin(REVIEWER, sessionId, pin({ channel: 5 }))).rejects.toMatchObject({ status: 422 });
    // A capture of another log is not part of this review.
    await expect(captures.addPin(REVIEWER, sessionId, { ...pin(), captureId: publicCaptureId })).rejects.toMatchObject({ status: 404 });
    // The database holds the length limit too.
    await expect(world.pool.query("insert into capture_pins (capture_id, session_id, author_id, time_s, body) values ($1, $2, $3, 0, $4)", [captureId, sessionId, REVIEWER.id, "x".repeat(2001)])).rejects.toThrow(/capture_pin_body_length/);
  });

  it("are refused once the session is not accepted or delivered", async () => {
    const requested = await reviewSession(world, logId, OTHER_REVIEWER.id, "requested");
    await expect(captures.addPin(OTHER_REVIEWER, requested, pin())).rejects.toMatchObject({ status: 409 });
    const closed = await reviewSession(world, logId, OTHER_REVIEWER.id, "closed");
    await expect(captures.addPin(OTHER_REVIEWER, closed, pin())).rejects.toMatchObject({ status: 409 });
    const delivered = await reviewSession(world, logId, OTHER_REVIEWER.id, "delivered");
    await expect(captures.addPin(OTHER_REVIEWER, delivered, pin({ body: "Second reviewer's note." }))).resolves.toMatchObject({ id: expect.any(String) });
  });

  it("are seen by the builder and moderators in full, by each reviewer for their own sessions, by a visitor not at all", async () => {
    const bodies = async (viewer: typeof BUILDER | null) => {
      const detail = await captures.captureForViewer(viewer, captureId);
      if (!detail) return null;
      return (await captures.pinsFor(captureId, viewer, detail.access)).map((p) => p.body);
    };
    const all = await bodies(BUILDER);
    expect(all).toHaveLength(2);
    expect(all).toContain("Second reviewer's note.");
    expect(await bodies(MODERATOR)).toHaveLength(2);
    // Stored as typed; the page shows it as plain text.
    expect(await bodies(REVIEWER)).toEqual([pin().body]);
    expect(await bodies(OTHER_REVIEWER)).toEqual(["Second reviewer's note."]);
    expect(await bodies(STRANGER)).toBeNull();
  });
});
