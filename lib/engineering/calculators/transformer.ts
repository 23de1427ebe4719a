import type { TransformerCalcInput } from "@/lib/validations/calc";
import { WAVEFORM_FACTORS, forwardTurns, transformerTurns } from "../transformer";

export interface TransformerResult {
  mode: "sine" | "square" | "forward";
  waveformFactor: number | null;
  /** V·ton of the forward primary; null for sine/square */
  voltSecondsVs: number | null;
  primaryTurns: number;
  /** rounded up, so the flux never exceeds the design figure */
  primaryTurnsRounded: number;
  /** peak flux (sine/square) or flux swing (forward) with the rounded turns */
  fluxAtRoundedTurnsT: number;
  /** Ns = Np(rounded)·Vs/Vp; null without a secondary voltage */
  secondaryTurns: number | null;
  secondaryTurnsRounded: number | null;
  /** primary : secondary voltage ratio, Vp/Vs */
  turnsRatio: number | null;
}

// A raw result of 20.000000000004 turns is 20 turns, not 21.
function roundUpTurns(raw: number): number {
  const whole = Math.round(raw);
  return Math.max(1, Math.abs(raw - whole) <= 1e-9 * Math.max(1, raw) ? whole : Math.ceil(raw));
}

export function calculateTransformer(input: TransformerCalcInput): TransformerResult {
  const primaryV = input.mode === "forward" ? input.busVolts : input.primaryV;
  let primaryTurns: number;
  let designFluxT: number;
  if (input.mode === "forward") {
    const { busVolts, onTimeS, fluxSwingT, coreAreaM2 } = input;
    primaryTurns = forwardTurns({ busVolts, onTimeS, fluxSwingT, coreAreaM2 });
    designFluxT = input.fluxSwingT;
  } else {
    primaryTurns = transformerTurns({
      volts: input.primaryV,
      frequencyHz: input.frequencyHz,
      peakFluxT: input.peakFluxT,
      coreAreaM2: input.coreAreaM2,
      waveform: input.mode,
    });
    designFluxT = input.peakFluxT;
  }
  const primaryTurnsRounded = roundUpTurns(primaryTurns);
  const secondaryTurns = input.secondaryV === undefined ? null : (primaryTurnsRounded * input.secondaryV) / primaryV;
  return {
    mode: input.mode,
    waveformFactor: input.mode === "forward" ? null : WAVEFORM_FACTORS[input.mode],
    voltSecondsVs: input.mode === "forward" ? input.busVolts * input.onTimeS : null,
    primaryTurns,
    primaryTurnsRounded,
    fluxAtRoundedTurnsT: (designFluxT * primaryTurns) / primaryTurnsRounded,
    secondaryTurns,
    secondaryTurnsRounded: secondaryTurns === null ? null : roundUpTurns(secondaryTurns),
    turnsRatio: input.secondaryV === undefined ? null : primaryV / input.secondaryV,
  };
}
