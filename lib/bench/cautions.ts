import type { BringUpStage } from "@/db/schema/listings";
import type { ReadingVerdict } from "@/db/schema/bench";
import { SAFE_VOLTAGE_V, unitQuantity, type Quantity } from "@/lib/engineering";

// Type-only imports above keep drizzle out of the browser bundle.

export type CautionKind = "discharge" | "cool-down" | "control-supply" | "far-outside";

export type ReadingCaution = { kind: CautionKind; title: string; text: string };

export type CautionInput = {
  stage: BringUpStage;
  name: string;
  measure: string;
  unit: string;
  verdict: ReadingVerdict;
  farOutside: boolean;
};

const DISCHARGE_STEP = `Disconnect mains and wait for the bus to discharge below ${SAFE_VOLTAGE_V} V — check with a meter — before touching anything.`;

const CAUTIONS: Record<CautionKind, ReadingCaution> = {
  discharge: {
    kind: "discharge",
    title: "Stop: the bus may be charged to a dangerous voltage",
    text: DISCHARGE_STEP,
  },
  "cool-down": {
    kind: "cool-down",
    title: "Stop and let it cool",
    text: `Switch off at once and let the heatsinks, switches and magnetics cool before you look for the cause. ${DISCHARGE_STEP}`,
  },
  "control-supply": {
    kind: "control-supply",
    title: "Stop before going on to mains power",
    text: "Switch off the bench supply and find the cause with the mains side still unconnected; do not go on to the series-lamp stage until this reading is within its range.",
  },
  "far-outside": {
    kind: "far-outside",
    title: "Stop: this reading is far outside its range",
    text: `Switch off, disconnect mains and discharge the bus before investigating. ${DISCHARGE_STEP}`,
  },
};

function quantityOf(unit: string): Quantity | null {
  try {
    return unitQuantity(unit);
  } catch {
    return null;
  }
}

const mentions = (input: CautionInput, word: RegExp) => word.test(`${input.name} ${input.measure}`);

/**
 * The caution a reading far outside its range shows, or null for readings within or only a
 * little off. The most specific danger wins: a charged bus, then heat at rated load, then the
 * general "stop, disconnect, discharge".
 */
export function cautionFor(input: CautionInput): ReadingCaution | null {
  if (!input.farOutside || input.verdict === "within") return null;
  const quantity = quantityOf(input.unit);
  const high = input.verdict === "high";

  // At the control-supply stage the mains side is not connected yet; the bus holds no charge.
  if (input.stage === "control-supply") return CAUTIONS["control-supply"];
  // A high bus voltage, or a series lamp that stays bright (something draws current it should
  // not), leaves the bulk capacitors charged after the plug is pulled.
  if (high && quantity === "voltage" && (mentions(input, /\bbus\b/i) || input.stage === "series-lamp")) return CAUTIONS.discharge;
  if (high && input.stage === "series-lamp" && (quantity === "current" || mentions(input, /\blamp\b/i))) return CAUTIONS.discharge;
  // Too much current or heat at rated load cooks parts in seconds to minutes.
  if (high && input.stage === "rated-load" && (quantity === "current" || quantity === "temperature" || quantity === "power")) return CAUTIONS["cool-down"];
  return CAUTIONS["far-outside"];
}
