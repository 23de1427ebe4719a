// The probing caution beside a trace. Common practice: an earthed scope's probe ground clipped to a
// node at bus potential shorts it to earth; such nodes are probed differentially or with an isolated scope.
import { describe, expect, it } from "vitest";
import { probeCautionFor } from "@/lib/captures/probe-caution";

describe("probe caution", () => {
  it("names gate drives at any stage and mains-side traces once mains is connected", () => {
    expect(probeCautionFor({ stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary" })?.kind).toBe("gate-drive");
    expect(probeCautionFor({ stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage" })?.kind).toBe("mains-side");
    expect(probeCautionFor({ stage: "control-supply", name: "Drain waveform", measure: "Switch node with the bench supply on the bus" })?.kind).toBe("mains-side");
  });

  it("stays quiet for the low-voltage side before mains", () => {
    expect(probeCautionFor({ stage: "control-supply", name: "Control supply current", measure: "Current from the 15 V bench supply" })).toBeNull();
  });

  it("asks for a differential probe or an isolated scope", () => {
    const caution = probeCautionFor({ stage: "rated-load", name: "Output ripple", measure: "Output voltage ripple" });
    expect(caution?.text).toMatch(/differential probe/);
    expect(caution?.text).toMatch(/isolated scope/);
  });
});
