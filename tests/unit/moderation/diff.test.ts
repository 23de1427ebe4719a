import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { diffSnapshots, lineDiff, noteChanges, recordChanges, snapshotDiffIsEmpty, textDiff, type DiffLine } from "@/lib/moderation/diff";

const render = (lines: DiffLine[]) => lines.map((l) => `${l.op === "same" ? " " : l.op === "added" ? "+" : "-"}${l.text}`);
const kept = (lines: DiffLine[]) => lines.filter((l) => l.op === "same").length;

/** Exhaustive reference: the longest common subsequence found by trying every subsequence of `a`. */
function bruteForceLcsLength(a: string[], b: string[]): number {
  let best = 0;
  for (let mask = 0; mask < 1 << a.length; mask++) {
    const sub = a.filter((_, i) => mask & (1 << i));
    let j = 0;
    for (const x of b) if (j < sub.length && sub[j] === x) j++;
    if (j === sub.length) best = Math.max(best, sub.length);
  }
  return best;
}

describe("lineDiff", () => {
  it("keeps an LCS of length 4 for the textbook pair ABCBDAB / BDCABA", () => {
    // Cormen, Leiserson, Rivest, Stein, Introduction to Algorithms, 3rd ed., §15.4, fig. 15.8:
    // X = ⟨A,B,C,B,D,A,B⟩, Y = ⟨B,D,C,A,B,A⟩ have an LCS of length 4.
    const diff = lineDiff([..."ABCBDAB"], [..."BDCABA"]);
    expect(kept(diff)).toBe(4);
    // GNU diffutils 3.8 (`diff --old-line-format='-%L' --new-line-format='+%L' --unchanged-line-format=' %L'`)
    // on the same two files removes 3 lines and adds 2: the same minimal edit size.
    expect(diff.filter((l) => l.op === "removed")).toHaveLength(3);
    expect(diff.filter((l) => l.op === "added")).toHaveLength(2);
  });

  it("matches GNU diff line for line on an edited stored-charge note", () => {
    const before = ["Unplug the welder and wait.", "The bus holds 30 J at 358 V.", "Measure across the bus with a meter.", "Only then touch the board."];
    const after = [
      "Unplug the welder and wait 60 s.",
      "The bus holds 30 J at 358 V.",
      "The 47 kOhm bleeder takes 40 s to bring it below 60 V.",
      "Measure across the bus with a meter.",
      "Only then touch the board.",
    ];
    // Output of GNU diffutils 3.8 with the formats above, on these lines as two files.
    expect(render(lineDiff(before, after))).toEqual([
      "-Unplug the welder and wait.",
      "+Unplug the welder and wait 60 s.",
      " The bus holds 30 J at 358 V.",
      "+The 47 kOhm bleeder takes 40 s to bring it below 60 V.",
      " Measure across the bus with a meter.",
      " Only then touch the board.",
    ]);
  });

  it("handles empty sides", () => {
    expect(lineDiff([], [])).toEqual([]);
    expect(render(lineDiff([], ["a", "b"]))).toEqual(["+a", "+b"]);
    expect(render(lineDiff(["a"], []))).toEqual(["-a"]);
    expect(textDiff("", "")).toEqual([]);
    expect(render(textDiff("one\r\ntwo", "one\ntwo"))).toEqual([" one", " two"]);
  });

  it("always rebuilds both texts and keeps a longest common subsequence (checked exhaustively on small inputs)", () => {
    const lines = fc.array(fc.constantFrom("a", "b", "c"), { maxLength: 9 });
    fc.assert(
      fc.property(lines, lines, (a, b) => {
        const diff = lineDiff(a, b);
        expect(diff.filter((l) => l.op !== "added").map((l) => l.text)).toEqual(a);
        expect(diff.filter((l) => l.op !== "removed").map((l) => l.text)).toEqual(b);
        expect(kept(diff)).toBe(bruteForceLcsLength(a, b));
      }),
      { numRuns: 400 },
    );
  });
});

describe("recordChanges", () => {
  it("lists only the keys whose values differ, ignoring key order inside nested values", () => {
    const before = { busCapacitanceF: 0.00047, bleederOhm: 47000, windings: [{ turns: 18, name: "primary" }] };
    const after = { busCapacitanceF: 0.00068, bleederOhm: 47000, windings: [{ name: "primary", turns: 18 }], mainsVrms: 230 };
    expect(recordChanges(before, after)).toEqual([
      { key: "busCapacitanceF", before: 0.00047, after: 0.00068 },
      { key: "mainsVrms", before: undefined, after: 230 },
    ]);
  });
});

describe("noteChanges", () => {
  it("reports each topic as added, removed or changed, with the wait", () => {
    const before = [
      { topic: "stored-charge", text: "Wait before touching.", waitSeconds: 30 },
      { topic: "live-heatsinks", text: "The heatsinks are live." },
      { topic: "codes-and-competence", text: "Follow local codes." },
    ];
    const after = [
      { topic: "codes-and-competence", text: "Follow local codes." },
      { topic: "stored-charge", text: "Wait before touching.", waitSeconds: 60 },
      { topic: "mains-isolation", text: "Unplug first." },
    ];
    const changes = noteChanges(before, after, ["mains-isolation", "stored-charge", "live-heatsinks", "codes-and-competence"]);
    expect(changes.map((c) => [c.topic, c.change])).toEqual([
      ["mains-isolation", "added"],
      ["stored-charge", "changed"],
      ["live-heatsinks", "removed"],
    ]);
    expect(changes[1]).toMatchObject({ waitBefore: 30, waitAfter: 60 });
    expect(render(changes[2]!.lines)).toEqual(["-The heatsinks are live."]);
  });
});

describe("diffSnapshots", () => {
  const approved = {
    title: "Half-bridge driver kit",
    kind: "kit",
    magneticSubtype: null,
    descriptionMd: "A kit.\nTwo boards.",
    figures: { mainsVrms: 230 },
    declaration: { mainsConnected: true, mainsVrms: 230, bleederOhm: 47000 },
    safetyNotes: [{ topic: "stored-charge", text: "Wait 60 s.", waitSeconds: 60 }],
    checkpoints: [{ stage: "series-lamp", name: "Bus", measure: "DC bus", unit: "V", expectedMin: 300, expectedMax: 340 }],
    requirements: [],
  };

  it("is empty for an unchanged listing", () => {
    expect(snapshotDiffIsEmpty(diffSnapshots(approved, structuredClone(approved)))).toBe(true);
  });

  it("does not report parts an older snapshot never recorded", () => {
    const { kind: _kind, magneticSubtype: _subtype, checkpoints: _checkpoints, ...partial } = approved;
    const d = diffSnapshots(partial, { ...approved, kind: "magnetic", checkpoints: [] });
    expect(d.kind).toEqual([]);
    expect(d.checkpoints).toBeNull();
    expect(snapshotDiffIsEmpty(d)).toBe(true);
  });

  it("names each changed part", () => {
    const now = {
      ...approved,
      descriptionMd: "A kit.\nThree boards.",
      declaration: { ...approved.declaration, bleederOhm: 100000 },
      checkpoints: [{ ...approved.checkpoints[0]!, expectedMax: 360 }],
    };
    const d = diffSnapshots(approved, now);
    expect(d.title).toBeNull();
    expect(render(d.description!)).toEqual([" A kit.", "-Two boards.", "+Three boards."]);
    expect(d.declaration).toEqual([{ key: "bleederOhm", before: 47000, after: 100000 }]);
    expect(render(d.checkpoints!)).toEqual(["-series-lamp · Bus: DC bus 300–340 V", "+series-lamp · Bus: DC bus 300–360 V"]);
    expect(d.notes).toEqual([]);
    expect(snapshotDiffIsEmpty(d)).toBe(false);
  });
});
