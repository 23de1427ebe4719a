import { describe, expect, it } from "vitest";
import { latestReadings, summariseProgress, type ProgressCheckpoint } from "@/lib/bench/progress";

// The demo kit's layout (db/seed-listings.ts): 3 control-supply, 3 series-lamp, 1 low-current, 2 rated-load.
const checkpoints: ProgressCheckpoint[] = [
  { id: "gate-f", stage: "control-supply" },
  { id: "gate-d", stage: "control-supply" },
  { id: "ctrl-i", stage: "control-supply" },
  { id: "bus", stage: "series-lamp" },
  { id: "ocv", stage: "series-lamp" },
  { id: "idle", stage: "series-lamp" },
  { id: "limit", stage: "low-current" },
  { id: "temp", stage: "rated-load" },
  { id: "imax", stage: "rated-load" },
];
const at = (minute: number) => new Date(Date.UTC(2025, 0, 1, 10, minute));

describe("summariseProgress", () => {
  it("lists the four stages in bring-up order with their labels, even before any reading", () => {
    const rows = summariseProgress(checkpoints, []);
    expect(rows.map((r) => [r.stage, r.label, r.checkpoints, r.read])).toEqual([
      ["control-supply", "Control supply only", 3, 0],
      ["series-lamp", "First mains power through a series lamp", 3, 0],
      ["low-current", "Low-current load", 1, 0],
      ["rated-load", "Rated load", 2, 0],
    ]);
  });

  it("counts checkpoints with a reading and the verdict of each one's newest reading", () => {
    const rows = summariseProgress(checkpoints, [
      { checkpointId: "gate-f", verdict: "low", takenAt: at(1) },
      // Re-measured after a fix: the newer reading replaces the low one.
      { checkpointId: "gate-f", verdict: "within", takenAt: at(5) },
      { checkpointId: "gate-d", verdict: "within", takenAt: at(2) },
      { checkpointId: "bus", verdict: "high", takenAt: at(9) },
      { checkpointId: "idle", verdict: "low", takenAt: at(10) },
    ]);
    expect(rows[0]).toMatchObject({ checkpoints: 3, read: 2, within: 2, low: 0, high: 0 });
    expect(rows[1]).toMatchObject({ checkpoints: 3, read: 2, within: 0, low: 1, high: 1 });
    expect(rows[2]).toMatchObject({ checkpoints: 1, read: 0, within: 0, low: 0, high: 0 });
  });

  it("ignores readings of checkpoints that are not in the list and shows an empty stage as zero", () => {
    const rows = summariseProgress([{ id: "own", stage: "low-current" }], [{ checkpointId: "elsewhere", verdict: "high", takenAt: at(1) }]);
    expect(rows.map((r) => r.checkpoints)).toEqual([0, 0, 1, 0]);
    expect(rows.every((r) => r.read === 0 && r.high === 0)).toBe(true);
  });
});

describe("latestReadings", () => {
  it("keeps the newest reading per checkpoint whatever the input order", () => {
    const latest = latestReadings([
      { checkpointId: "bus", verdict: "within", takenAt: at(8) },
      { checkpointId: "bus", verdict: "high", takenAt: at(3) },
    ]);
    expect(latest.get("bus")?.verdict).toBe("within");
  });
});
