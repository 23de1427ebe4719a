import { calculateTransformer, type TransformerResult } from "@/lib/engineering/calculators";
import { transformerCalcSchema } from "@/lib/validations/calc";
import {
  compute,
  countErrors,
  errorsFromZod,
  invalidMessage,
  readSi,
  type NumberSpec,
  type Outcome,
} from "./live-input";

export const TRANSFORMER_FIELDS = [
  "primaryV",
  "frequencyHz",
  "peakFluxT",
  "busVolts",
  "onTimeS",
  "fluxSwingT",
  "coreAreaM2",
  "secondaryV",
] as const;
export type TransformerField = (typeof TRANSFORMER_FIELDS)[number];
export type TransformerMode = "sine" | "square" | "forward";
export type TransformerValues = Record<TransformerField | "mode", string>;

export const TRANSFORMER_SPECS: Record<TransformerField, NumberSpec> = {
  primaryV: { label: "Primary voltage", unit: "V", toSi: 1 },
  frequencyHz: { label: "Frequency", unit: "kHz", toSi: 1e3 },
  peakFluxT: { label: "Peak flux density", unit: "T", toSi: 1 },
  busVolts: { label: "Voltage across the primary", unit: "V", toSi: 1 },
  onTimeS: { label: "On-time", unit: "µs", toSi: 1e-6 },
  fluxSwingT: { label: "Flux swing", unit: "T", toSi: 1 },
  coreAreaM2: { label: "Core area Ae", unit: "mm²", toSi: 1e-6 },
  secondaryV: { label: "Secondary voltage", unit: "V", toSi: 1 },
};

// An invented half-bridge welder transformer: 170 V square wave at 40 kHz on a 240 mm² ferrite
// core, with a 60 V secondary; the forward example runs 325 V for 8 µs.
export const TRANSFORMER_DEFAULTS: TransformerValues = {
  mode: "square",
  primaryV: "170",
  frequencyHz: "40",
  peakFluxT: "0.15",
  busVolts: "325",
  onTimeS: "8",
  fluxSwingT: "0.2",
  coreAreaM2: "240",
  secondaryV: "60",
};

export function evaluateTransformer(values: TransformerValues): Outcome<TransformerResult, TransformerField> {
  const shared = {
    coreAreaM2: readSi(values.coreAreaM2, TRANSFORMER_SPECS.coreAreaM2),
    secondaryV: readSi(values.secondaryV, TRANSFORMER_SPECS.secondaryV),
  };
  const body =
    values.mode === "forward"
      ? {
          mode: "forward",
          busVolts: readSi(values.busVolts, TRANSFORMER_SPECS.busVolts),
          onTimeS: readSi(values.onTimeS, TRANSFORMER_SPECS.onTimeS),
          fluxSwingT: readSi(values.fluxSwingT, TRANSFORMER_SPECS.fluxSwingT),
          ...shared,
        }
      : {
          mode: values.mode,
          primaryV: readSi(values.primaryV, TRANSFORMER_SPECS.primaryV),
          frequencyHz: readSi(values.frequencyHz, TRANSFORMER_SPECS.frequencyHz),
          peakFluxT: readSi(values.peakFluxT, TRANSFORMER_SPECS.peakFluxT),
          ...shared,
        };
  const parsed = transformerCalcSchema.safeParse(body);
  if (!parsed.success) {
    const { fieldErrors } = errorsFromZod<TransformerField>(parsed.error, { specs: TRANSFORMER_SPECS });
    return { ok: false, fieldErrors, message: invalidMessage(countErrors(fieldErrors)) };
  }
  const input = parsed.data;
  return compute(() => calculateTransformer(input), {
    volts: "primaryV",
    frequencyHz: "frequencyHz",
    peakFluxT: "peakFluxT",
    coreAreaM2: "coreAreaM2",
    busVolts: "busVolts",
    onTimeS: "onTimeS",
    fluxSwingT: "fluxSwingT",
  });
}
