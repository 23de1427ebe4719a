import { convertUnit, SUPPORTED_UNITS, unitQuantity, type Quantity } from "@/lib/engineering";

export type UnitChoices = {
  /** The units a reading may be typed in, smallest prefix first; the checkpoint's own spelling included. */
  units: string[];
  /** What the unit measures, or null for a unit the converter does not know (a builder's "rpm"). */
  quantity: Quantity | null;
};

const QUANTITY_WORDS: Record<Quantity, string> = {
  voltage: "voltage",
  current: "current",
  frequency: "frequency",
  time: "time",
  resistance: "resistance",
  capacitance: "capacitance",
  inductance: "inductance",
  power: "power",
  energy: "energy",
  "flux-density": "flux density",
  temperature: "temperature",
  ratio: "a ratio",
};

function quantityOf(unit: string): Quantity | null {
  try {
    return unitQuantity(unit);
  } catch {
    return null;
  }
}

/**
 * The units the reading form offers for a checkpoint: every unit of the same quantity (kHz →
 * Hz, kHz, MHz). A unit the converter does not know is offered alone and stored as typed.
 */
export function unitChoices(checkpointUnit: string): UnitChoices {
  const quantity = quantityOf(checkpointUnit);
  if (quantity === null) return { units: [checkpointUnit], quantity };
  // Smallest unit first (pF before nF); units with an offset (K beside °C) keep the converter's order.
  const scale = (u: string) => convertUnit(1, u, checkpointUnit) - convertUnit(0, u, checkpointUnit);
  const family = SUPPORTED_UNITS.filter((u) => unitQuantity(u) === quantity).sort((a, b) => scale(a) - scale(b));
  // "uF" and "µF" are one unit; the select shows the checkpoint's own spelling.
  const units = family.map((u) => (u !== checkpointUnit && convertUnit(1, u, checkpointUnit) === 1 && convertUnit(0, u, checkpointUnit) === 0 ? checkpointUnit : u));
  return { units: units.includes(checkpointUnit) ? units : [checkpointUnit, ...units], quantity };
}

export type Converted = { ok: true; value: number } | { ok: false; message: string };

/**
 * A typed reading in the checkpoint's unit, or why it cannot be: the same spelling passes
 * unchanged (even for units the converter does not know); otherwise both must measure the same
 * quantity.
 */
export function toCheckpointUnit(value: number, enteredUnit: string, checkpointUnit: string): Converted {
  if (enteredUnit.trim() === checkpointUnit.trim()) return { ok: true, value };
  const from = quantityOf(enteredUnit);
  const to = quantityOf(checkpointUnit);
  const offered = unitChoices(checkpointUnit).units.join(", ");
  if (to === null) return { ok: false, message: `This checkpoint is recorded in ${checkpointUnit}; enter the reading in ${checkpointUnit}.` };
  if (from === null) return { ok: false, message: `${enteredUnit} is not a unit Fluxyard knows. Enter the reading in one of ${offered}.` };
  if (from !== to) {
    return {
      ok: false,
      message: `${enteredUnit} measures ${QUANTITY_WORDS[from]}, but this checkpoint measures ${QUANTITY_WORDS[to]} in ${checkpointUnit}. Enter the reading in one of ${offered}.`,
    };
  }
  return { ok: true, value: convertUnit(value, enteredUnit, checkpointUnit) };
}
