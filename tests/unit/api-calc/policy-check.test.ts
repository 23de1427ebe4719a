import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/policy/check/route";
import { fullNotes, mainsKit, welderKit } from "../policy/fixtures";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/policy/check", () => {
  it("returns status, findings and the worked-example profile", async () => {
    const { status, json } = await call(POST, { declaration: mainsKit, notes: [] });
    expect(status).toBe(200);
    expect(json.status).toBe("incomplete");
    expect(json.revision).toBe(1);
    expectRelClose(json.profile.busPeakV, 357.8, 1e-4);
    expectRelClose(json.profile.dischargeS, 83.9, 1e-3);
    expect(json.findings.map((f: { code: string }) => f.code)).toEqual(["missing", "missing", "missing", "missing", "missing"]);
    const stored = json.findings.find((f: { topic: string }) => f.topic === "stored-charge");
    expect(stored.message).toContain("at least 84 s");
  });

  it("is clear for a complete sheet and blocked for an OCV over the limit (IEC 60974-1, from memory)", async () => {
    expect((await call(POST, { declaration: welderKit, notes: fullNotes() })).json.status).toBe("clear");
    const blocked = await call(POST, { declaration: { ...welderKit, openCircuitV: 130 }, notes: fullNotes() });
    expect(blocked.status).toBe(200);
    expect(blocked.json.status).toBe("blocked");
  });

  it("checks against a named revision, and answers 422 for one that does not exist", async () => {
    expect((await call(POST, { declaration: mainsKit, notes: fullNotes(), revision: 1 })).json.status).toBe("clear");
    const { status, json } = await call(POST, { declaration: mainsKit, notes: [], revision: 42 });
    expect(status).toBe(422);
    expect(json.fieldErrors.revision[0]).toMatch(/no policy revision 42/);
  });

  it("answers 422 with nested field paths for an invalid declaration", async () => {
    const { status, json } = await call(POST, { declaration: { mainsConnected: true, liveHeatsinks: false, weldingSource: false }, notes: [{ topic: "stored-charge", text: "x", waitSeconds: -5 }] });
    expect(status).toBe(422);
    expect(Object.keys(json.fieldErrors).sort()).toEqual(["declaration.mainsVrms", "notes.0.waitSeconds"]);
  });

  it("answers 422 for a body that is not JSON", async () => {
    const { status, json } = await call(POST, "declaration=1");
    expect(status).toBe(422);
    expect(json).toMatchObject({ error: "invalid_input" });
  });
});
