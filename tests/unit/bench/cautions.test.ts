import { describe, expect, it } from "vitest";
import { cautionFor, type CautionInput } from "@/lib/bench/cautions";
import { classifyReading } from "@/lib/engineering";

// The demo kit's checkpoints (db/seed-listings.ts), as a builder meets them.
const bus = { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the 100 W series lamp in circuit", unit: "V" } as const;
const idle = { stage: "series-lamp", name: "Idle input current", measure: "Mains current at idle", unit: "A" } as const;
const lamp = { stage: "series-lamp", name: "Lamp after charging", measure: "Lamp brightness once the bus has charged", unit: "%" } as const;
const maxCurrent = { stage: "rated-load", name: "Maximum output current", measure: "Output current with the dial at maximum", unit: "A" } as const;
const heatsink = { stage: "rated-load", name: "Primary heatsink temperature", measure: "Heatsink temperature after 5 min at 120 A", unit: "°C" } as const;
const gate = { stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary", unit: "kHz" } as const;
const limit = { stage: "low-current", name: "Current-limit response", measure: "Output current into a 0.1 Ω load with the dial at minimum", unit: "A" } as const;

/** The verdict as the server makes it, so the cases below are real readings, not hand-set flags. */
function reading(checkpoint: Omit<CautionInput, "verdict" | "farOutside">, value: number, min: number, max: number): CautionInput {
  return { ...checkpoint, ...classifyReading({ value, min, max }) };
}

// The 60 V threshold is the ES1 limit of IEC 62368-1 (from memory); waiting for the bleeders and
// checking with a meter before touching is common practice for charged mains buses.
const DISCHARGE = "Disconnect mains and wait for the bus to discharge below 60 V — check with a meter — before touching anything.";

describe("cautionFor: which caution a reading far outside its range shows", () => {
  it("a bus voltage far above 290–335 V behind the series lamp → disconnect and discharge", () => {
    const caution = cautionFor(reading(bus, 420, 290, 335));
    expect(caution?.kind).toBe("discharge");
    expect(caution?.text).toBe(DISCHARGE);
  });

  it("nothing for a reading within, or only a little outside, its range", () => {
    expect(cautionFor(reading(bus, 335, 290, 335))).toBeNull();
    // 25 % of the 45 V range width is 11.25 V: 346 V is high, but not far.
    expect(cautionFor(reading(bus, 346, 290, 335))).toBeNull();
  });

  it("a lamp that stays bright, or a high idle current, at the series-lamp stage → discharge (common practice: the lamp glows while something draws current)", () => {
    expect(cautionFor(reading(lamp, 90, 0, 20))?.kind).toBe("discharge");
    expect(cautionFor(reading(idle, 1.5, 0.05, 0.4))?.kind).toBe("discharge");
  });

  it("a high current or temperature at rated load → stop and let it cool, then discharge", () => {
    const current = cautionFor(reading(maxCurrent, 200, 150, 170));
    expect(current?.kind).toBe("cool-down");
    expect(current?.text).toContain("let the heatsinks, switches and magnetics cool");
    expect(current?.text).toContain(DISCHARGE);
    expect(cautionFor(reading(heatsink, 110, 20, 75))?.kind).toBe("cool-down");
  });

  it("far outside otherwise → stop, disconnect and discharge before investigating", () => {
    expect(cautionFor(reading(maxCurrent, 100, 150, 170))?.kind).toBe("far-outside");
    expect(cautionFor(reading(limit, 60, 18, 30))?.kind).toBe("far-outside");
    expect(cautionFor(reading(bus, 150, 290, 335))?.text).toContain("disconnect mains and discharge the bus before investigating");
  });

  it("at the control-supply stage (no mains connected yet) → switch off the bench supply and do not go on", () => {
    const caution = cautionFor(reading(gate, 80, 38, 42));
    expect(caution?.kind).toBe("control-supply");
    expect(caution?.text).toContain("do not go on to the series-lamp stage");
  });
});
