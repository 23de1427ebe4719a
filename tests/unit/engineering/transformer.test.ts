import { describe, expect, it } from "vitest";
import { forwardTurns, transformerTurns } from "@/lib/engineering";
import { expectRelClose } from "./support";

describe("transformerTurns (EMF equation V = Kf·f·N·Ae·B; McLyman, ch. 1)", () => {
  it("sine, Kf 4.44: 230 V, 50 Hz, 10 cm², 1.2 T → 863.4 turns", () => {
    const n = transformerTurns({ volts: 230, frequencyHz: 50, peakFluxT: 1.2, coreAreaM2: 10e-4, waveform: "sine" });
    expectRelClose(n, 230 / (4.44 * 50 * 10e-4 * 1.2), 1e-12);
    expectRelClose(n, 863.36, 1e-5);
    expect(Number.isInteger(n)).toBe(false); // not rounded
  });

  it("agrees with the mains-transformer rule of ≈45 turns per volt ÷ Ae(cm²) at 50 Hz, 1 T (common practice)", () => {
    const perVolt = transformerTurns({ volts: 1, frequencyHz: 50, peakFluxT: 1, coreAreaM2: 10e-4, waveform: "sine" });
    expectRelClose(perVolt, 45 / 10, 0.01);
  });

  it("square, Kf 4.0: 325 V, 50 kHz, 0.15 T, 3.6 cm² → 30.09 turns", () => {
    const n = transformerTurns({ volts: 325, frequencyHz: 50e3, peakFluxT: 0.15, coreAreaM2: 3.6e-4, waveform: "square" });
    expectRelClose(n, 30.0926, 1e-5);
  });

  it("the square-wave form is the volt-second form over half a period with ΔB = 2·Bpk (Erickson & Maksimović, ch. 15)", () => {
    const f = 40e3;
    const square = transformerTurns({ volts: 300, frequencyHz: f, peakFluxT: 0.1, coreAreaM2: 2e-4, waveform: "square" });
    const voltSeconds = forwardTurns({ busVolts: 300, onTimeS: 1 / (2 * f), fluxSwingT: 0.2, coreAreaM2: 2e-4 });
    expectRelClose(square, voltSeconds, 1e-12);
  });
});

describe("forwardTurns (volt-second balance N = V·ton/(ΔB·Ae); Erickson & Maksimović, ch. 15)", () => {
  it("340 V for 4 µs on 1.5 cm² with 0.2 T swing → 45.33 turns", () => {
    const n = forwardTurns({ busVolts: 340, onTimeS: 4e-6, fluxSwingT: 0.2, coreAreaM2: 1.5e-4 });
    expectRelClose(n, (340 * 4e-6) / (0.2 * 1.5e-4), 1e-12);
    expectRelClose(n, 45.333, 1e-4);
  });
});
