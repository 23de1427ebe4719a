import { finiteResult, requireObject, requireOneOf, requirePositive } from "./errors";

/**
 * Waveform coefficient of the EMF equation V = Kf·f·N·Ae·B: 4.44 (≈ π·√2) for a sine wave
 * given as RMS volts, 4.0 for a square wave given as its amplitude (McLyman, "Transformer and
 * Inductor Design Handbook", ch. 1).
 */
export const WAVEFORM_FACTORS = { sine: 4.44, square: 4.0 } as const;
export type Waveform = keyof typeof WAVEFORM_FACTORS;

export interface TransformerTurnsInput {
  /** winding voltage: RMS for a sine, amplitude for a square wave */
  volts: number;
  frequencyHz: number;
  peakFluxT: number;
  coreAreaM2: number;
  waveform: Waveform;
}

/** N = V / (Kf·f·Ae·B), not rounded (round up to whole turns where you wind them). */
export function transformerTurns(input: TransformerTurnsInput): number {
  const i = requireObject("input", input);
  const v = requirePositive("volts", i.volts);
  const f = requirePositive("frequencyHz", i.frequencyHz);
  const b = requirePositive("peakFluxT", i.peakFluxT);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  const waveform = requireOneOf("waveform", i.waveform, ["sine", "square"] as const);
  return finiteResult("volts", v / (WAVEFORM_FACTORS[waveform] * f * ae * b));
}

export interface ForwardTurnsInput {
  busVolts: number;
  /** the switch on-time, s */
  onTimeS: number;
  /** the flux swing ΔB over one on-time, T */
  fluxSwingT: number;
  coreAreaM2: number;
}

/** Volt-second form: N = V·ton / (ΔB·Ae), not rounded (Erickson & Maksimović, ch. 15). */
export function forwardTurns(input: ForwardTurnsInput): number {
  const i = requireObject("input", input);
  const v = requirePositive("busVolts", i.busVolts);
  const ton = requirePositive("onTimeS", i.onTimeS);
  const db = requirePositive("fluxSwingT", i.fluxSwingT);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  return finiteResult("busVolts", (v * ton) / (db * ae));
}
