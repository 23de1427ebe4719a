import { EngineeringInputError, finiteResult, requireFinite } from "./errors";

export type Quantity =
  | "voltage"
  | "current"
  | "frequency"
  | "time"
  | "resistance"
  | "capacitance"
  | "inductance"
  | "power"
  | "energy"
  | "flux-density"
  | "temperature"
  | "ratio";

interface UnitDefinition {
  quantity: Quantity;
  /** value in the base unit = value · factor · 10^exponent + offset */
  exponent: number;
  /** for units that are not a power of ten of the base (minutes) */
  factor?: number;
  /** temperatures only: K → °C */
  offset?: number;
}

const PREFIXES: Record<string, number> = { n: -9, "µ": -6, m: -3, "": 0, k: 3, M: 6 };

function prefixed(base: string, quantity: Quantity, prefixes: string[]): Record<string, UnitDefinition> {
  const out: Record<string, UnitDefinition> = {};
  for (const p of prefixes) out[`${p}${base}`] = { quantity, exponent: PREFIXES[p] ?? 0 };
  return out;
}

const UNITS: Record<string, UnitDefinition> = {
  ...prefixed("V", "voltage", ["µ", "m", "", "k"]),
  ...prefixed("A", "current", ["µ", "m", "", "k"]),
  ...prefixed("Hz", "frequency", ["", "k", "M"]),
  ...prefixed("s", "time", ["n", "µ", "m", ""]),
  min: { quantity: "time", exponent: 0, factor: 60 },
  ...prefixed("Ω", "resistance", ["m", "", "k", "M"]),
  ...prefixed("F", "capacitance", ["n", "µ", "m", ""]),
  pF: { quantity: "capacitance", exponent: -12 },
  ...prefixed("H", "inductance", ["n", "µ", "m", ""]),
  ...prefixed("W", "power", ["m", "", "k"]),
  ...prefixed("J", "energy", ["m", "", "k"]),
  ...prefixed("T", "flux-density", ["m", ""]),
  "°C": { quantity: "temperature", exponent: 0 },
  K: { quantity: "temperature", exponent: 0, offset: -273.15 },
  "%": { quantity: "ratio", exponent: -2 },
};

/** Spellings people type: u for µ, the Greek mu, the ohm sign, "ohm", "degC". */
function canonical(unit: string): string {
  let u = unit.trim().replace(/\u03bc/g, "µ").replace(/\u2126/g, "Ω");
  u = u.replace(/ohms?$/i, "Ω").replace(/^deg ?C$/i, "°C").replace(/^℃$/, "°C");
  if (/^u./.test(u)) u = `µ${u.slice(1)}`;
  return u;
}

export function unitQuantity(unit: string): Quantity {
  return lookup("unit", unit).quantity;
}

export const SUPPORTED_UNITS = Object.keys(UNITS);

function lookup(field: string, unit: unknown): UnitDefinition {
  const def = typeof unit === "string" ? UNITS[canonical(unit)] : undefined;
  if (!def) {
    throw new EngineeringInputError(field, `${String(unit)} is not a unit this converter knows (${SUPPORTED_UNITS.join(", ")}).`);
  }
  return def;
}

/**
 * Converts a reading between units of the same quantity (mV → V, µF → nF, K → °C …).
 * Negative values are allowed: rails and temperatures can be below zero.
 */
export function convertUnit(value: number, fromUnit: string, toUnit: string): number {
  const v = requireFinite("value", value);
  const from = lookup("fromUnit", fromUnit);
  const to = lookup("toUnit", toUnit);
  if (from.quantity !== to.quantity) {
    throw new EngineeringInputError(
      "toUnit",
      `Cannot convert ${fromUnit} (${from.quantity}) to ${toUnit} (${to.quantity}): they measure different things.`,
    );
  }
  const diff = from.exponent - to.exponent;
  const scaled = v * (from.factor ?? 1);
  const shifted = diff >= 0 ? scaled * 10 ** diff : scaled / 10 ** -diff;
  // Only temperatures carry offsets, and they have no prefixes, so scaling first is safe.
  const raw = (shifted + (from.offset ?? 0) - (to.offset ?? 0)) / (to.factor ?? 1);
  // Trim binary noise (2.2 µF → 2200.0000000000005 nF) without losing real digits.
  return finiteResult("value", Number(raw.toPrecision(15)));
}
