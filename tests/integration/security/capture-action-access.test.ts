// The scope-capture server actions of the access matrix (tests/support/access-matrix.ts), as each
// kind of person, in the captures tests' world (tests/integration/captures/world.ts), whose small
// file server stands in for the upload store so a capture is really read and measured. Each call
// gets a fresh log of member's with a reading and, where the action needs one, a measured capture.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ACTIONS, PERSONA_USER_IDS, PERSONAS, type Persona } from "../../support/access-matrix";
import { captureCsv, pulseTrain } from "../../support/captures";
import { BUILDER, logWithReadings, reviewSession, startWorld, uploadCapture, type World } from "../captures/world";
import { CAPTURE_ACTION_FILES, outcomeOf } from "./action-outcome";

const state = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/config", () => ({ auth: async () => (state.userId ? { user: { id: state.userId } } : null) }));
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));
// Removing a capture also deletes its file from the hosted store; this world has no such store to ask.
vi.mock("@/lib/uploads/store", async (importOriginal) => ({ ...(await importOriginal<typeof import("@/lib/uploads/store")>()), deleteStored: async () => {} }));

let world: World;
beforeAll(async () => {
  world = await startWorld("security_capture_actions");
}, 120_000);
afterAll(async () => {
  await world?.close();
});

const LOG_ACTIONS = "app/(bench)/bench/logs/[id]/capture-actions.ts";
const PIN_ACTIONS = "app/(bench)/reviews/[id]/captures/[captureId]/actions.ts";

/** A gate-drive trace at 20 kHz, small enough to be measured on the spot. */
function scopeCsv(): string {
  const trace = pulseTrain({ sampleRateHz: 20e6, samples: 10_000, frequencyHz: 20e3, dutyCyclePct: 40, lowV: 0, highV: 15, riseRampS: 300e-9, fallRampS: 300e-9, seed: 7 });
  return captureCsv(trace.timeS, [{ name: "CH1", unit: "V", values: trace.values }]);
}

async function memberReading() {
  const log = await logWithReadings(BUILDER.id, [{ checkpoint: "Gate-drive frequency", value: 20, unit: "kHz" }]);
  return { logId: log.logId, readingId: log.readingIds["Gate-drive frequency"]! };
}

async function measuredCapture() {
  const { logId, readingId } = await memberReading();
  const { attachCapture } = await import("@/db/queries/captures");
  const { measureCapture } = await import("@/lib/captures/measure");
  const { id } = await attachCapture(BUILDER, logId, { readingId, uploadKey: await uploadCapture(world, BUILDER.id, scopeCsv()) });
  expect(await measureCapture(id)).toBe("measured");
  return { logId, captureId: id };
}

const act = async (file: string, name: string, ...args: unknown[]) => {
  const m = (await import(/* @vite-ignore */ `@/${file}`)) as Record<string, (...a: unknown[]) => Promise<unknown>>;
  return m[name]!(...args);
};

const CALLS: Record<string, (persona: Persona) => Promise<unknown>> = {
  // Each person offers a capture file of their own: attaching it to someone else's reading must fail.
  [`${LOG_ACTIONS} attachCaptureAction`]: async (persona) => {
    const { logId, readingId } = await memberReading();
    const owner = persona === "visitor" ? BUILDER.id : PERSONA_USER_IDS[persona];
    return act(LOG_ACTIONS, "attachCaptureAction", logId, { readingId, uploadKey: await uploadCapture(world, owner, scopeCsv()) });
  },
  [`${LOG_ACTIONS} confirmProposalAction`]: async () => {
    const { logId, captureId } = await measuredCapture();
    return act(LOG_ACTIONS, "confirmProposalAction", logId, captureId, { channel: 0 });
  },
  [`${LOG_ACTIONS} removeCaptureAction`]: async () => {
    const { logId, captureId } = await measuredCapture();
    return act(LOG_ACTIONS, "removeCaptureAction", logId, captureId);
  },
  [`${PIN_ACTIONS} addPinAction`]: async () => {
    const { logId, captureId } = await measuredCapture();
    const sessionId = await reviewSession(world, logId, PERSONA_USER_IDS.reviewer, "accepted");
    return act(PIN_ACTIONS, "addPinAction", sessionId, { captureId, time: "12.5 µs", channel: 0, body: "The gate drive rings here; check the gate resistor." });
  },
};

describe("scope-capture actions, as each kind of person", () => {
  const entries = ACTIONS.filter((a) => CAPTURE_ACTION_FILES.includes(a.file));

  it("has a call for every capture action in the matrix", () => {
    expect(entries.length).toBeGreaterThan(0);
    expect(entries.map((a) => `${a.file} ${a.name}`).filter((k) => !(k in CALLS))).toEqual([]);
  });

  for (const entry of entries) {
    it(`${entry.name} (${entry.file})`, async () => {
      const wrong: string[] = [];
      for (const persona of PERSONAS) {
        state.userId = persona === "visitor" ? null : PERSONA_USER_IDS[persona];
        const { outcome, detail } = await outcomeOf(() => CALLS[`${entry.file} ${entry.name}`]!(persona));
        if (outcome !== entry.expect[persona]) wrong.push(`${persona}: expected ${entry.expect[persona]}, got ${outcome} (${detail})`);
      }
      expect(wrong, `${entry.file} ${entry.name}\n  ${wrong.join("\n  ")}`).toEqual([]);
    }, 120_000);
  }
});
