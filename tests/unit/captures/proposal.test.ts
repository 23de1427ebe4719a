// Which measured figure a checkpoint asks for, and that figure in the checkpoint's unit. The
// checkpoints are the demo welder kit's (db/seed-listings.ts); the conversions are the SI
// prefixes of the SI Brochure, 9th ed., table 7 (kilo = 10³, milli = 10⁻³, micro = 10⁻⁶).
import { describe, expect, it } from "vitest";
import { figureForCheckpoint, proposalForChannel, proposeReading, type ProposalChannel } from "@/lib/captures/proposal";
import type { PulseMeasurement } from "@/lib/engineering/waveform";

const GATE_FREQUENCY = { name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary", unit: "kHz" };
const GATE_DUTY = { name: "Gate-drive duty cycle", measure: "Duty cycle of one gate signal", unit: "%" };
const SUPPLY_CURRENT = { name: "Control supply current", measure: "Current from the 15 V bench supply", unit: "mA" };
const BUS = { name: "Bus voltage behind the lamp", measure: "DC bus voltage with the 100 W series lamp in circuit", unit: "V" };
const HEATSINK = { name: "Primary heatsink temperature", measure: "Heatsink temperature after 5 min at 120 A", unit: "°C" };

function figures(overrides: Partial<PulseMeasurement> = {}): PulseMeasurement {
  return {
    lowV: 0,
    highV: 15,
    amplitudeV: 15,
    frequencyHz: 40_000,
    periodS: 25e-6,
    dutyCyclePct: 44,
    riseTimeS: 160e-9,
    fallTimeS: 120e-9,
    overshootPct: 1,
    undershootPct: 1,
    pulseCount: 9,
    reason: null,
    referenceLevels: { low10: 1.5, mesial50: 7.5, high90: 13.5 },
    markers: { pulseStartS: 0, pulseEndS: 11e-6, nextPulseStartS: 25e-6 },
    ...overrides,
  };
}

const channel = (name: string, unit: string | null, f = figures()): ProposalChannel => ({ name, unit, figures: f });

describe("the figure a checkpoint measures", () => {
  it("follows the unit for frequency and levels, and the words for percentages and times", () => {
    expect(figureForCheckpoint(GATE_FREQUENCY)).toBe("frequencyHz");
    expect(figureForCheckpoint(GATE_DUTY)).toBe("dutyCyclePct");
    expect(figureForCheckpoint(BUS)).toBe("highV");
    expect(figureForCheckpoint({ name: "Gate swing", measure: "Peak-to-peak gate voltage", unit: "V" })).toBe("amplitudeV");
    expect(figureForCheckpoint({ name: "Gate off level", measure: "Low level of the gate during the off time", unit: "V" })).toBe("lowV");
    expect(figureForCheckpoint({ name: "Gate rise", measure: "Rise time of the gate, 10–90 %", unit: "ns" })).toBe("riseTimeS");
    expect(figureForCheckpoint({ name: "Switching period", measure: "Period of the PWM", unit: "µs" })).toBe("periodS");
    expect(figureForCheckpoint({ name: "On-time", measure: "Pulse width at 50 %", unit: "µs" })).toBe("pulseWidthS");
  });

  it("is none for what a scope capture does not give", () => {
    expect(figureForCheckpoint(HEATSINK)).toBeNull();
    // A percentage that is not a duty cycle or an aberration.
    expect(figureForCheckpoint({ name: "Efficiency", measure: "Output over input power", unit: "%" })).toBeNull();
    // A unit the converter does not know.
    expect(figureForCheckpoint({ name: "Fan", measure: "Fan speed", unit: "rpm" })).toBeNull();
    // A time that names no pulse figure (dead time is not measured).
    expect(figureForCheckpoint({ name: "Dead time", measure: "Between the two gates", unit: "ns" })).toBeNull();
  });
});

describe("the proposed reading", () => {
  it("gives 40 000 Hz as 40 kHz for the gate-drive frequency (kilo = 10³)", () => {
    const proposal = proposeReading(GATE_FREQUENCY, [channel("CH1", "V", figures({ frequencyHz: 40_000 }))]);
    expect(proposal).toMatchObject({ ok: true, figure: "frequencyHz" });
    expect(proposalForChannel(proposal, 0)).toMatchObject({ channel: 0, channelName: "CH1", measured: 40_000, measuredUnit: "Hz", value: 40, unit: "kHz" });
  });

  it("gives the duty cycle in per cent as measured, and offers each channel that has it, the first first", () => {
    const proposal = proposeReading(GATE_DUTY, [channel("CH1", "V", figures({ dutyCyclePct: 44 })), channel("CH2", "V", figures({ dutyCyclePct: 43.5 }))]);
    if (!proposal.ok) throw new Error(proposal.reason);
    expect(proposal.options.map((o) => [o.channel, o.value, o.unit])).toEqual([
      [0, 44, "%"],
      [1, 43.5, "%"],
    ]);
  });

  it("reads a level only from a channel of the same quantity, converting its prefix (milli = 10⁻³)", () => {
    // A current probe channel in A for a checkpoint in mA: 0.12 A is 120 mA.
    const current = proposeReading(SUPPLY_CURRENT, [channel("Probe V", "V", figures({ highV: 12 })), channel("Probe I", "A", figures({ highV: 0.12 }))]);
    if (!current.ok) throw new Error(current.reason);
    expect(current.options.map((o) => [o.channelName, o.value])).toEqual([["Probe I", 120]]);
    // A channel without a unit is taken as volts, as scopes write them.
    expect(proposalForChannel(proposeReading(BUS, [channel("CH1", null, figures({ highV: 318 }))]), 0)).toMatchObject({ value: 318, unit: "V" });
  });

  it("says why when no channel of the right quantity exists", () => {
    const proposal = proposeReading(SUPPLY_CURRENT, [channel("CH1", "V")]);
    expect(proposal.ok).toBe(false);
    if (proposal.ok) return;
    expect(proposal.reason).toMatch(/no channel of the capture is recorded in a unit of that quantity/);
  });

  it("passes on the measurement's reason when the figure is missing (fewer than two periods)", () => {
    const reason = "The capture holds fewer than two complete periods.";
    const proposal = proposeReading(GATE_FREQUENCY, [channel("CH1", "V", figures({ frequencyHz: null, periodS: null, dutyCyclePct: null, reason }))]);
    expect(proposal).toEqual({ ok: false, figure: "frequencyHz", reason: `No channel of the capture gave a frequency. CH1: ${reason}` });
    expect(proposalForChannel(proposal, 0)).toBeNull();
  });

  it("derives pulse width as duty cycle × period (IEEE Std 181: pulse duration over period)", () => {
    const proposal = proposeReading({ name: "On-time", measure: "Pulse width", unit: "µs" }, [channel("CH1", "V", figures({ dutyCyclePct: 40, periodS: 50e-6 }))]);
    // 40 % of 50 µs is 20 µs.
    expect(proposalForChannel(proposal, 0)?.value).toBeCloseTo(20, 9);
  });

  it("offers nothing for a channel index that has no option", () => {
    const proposal = proposeReading(GATE_FREQUENCY, [channel("CH1", "V")]);
    expect(proposalForChannel(proposal, 3)).toBeNull();
  });
});
