// Figures in seller-facing messages: three significant figures and the prefixes a builder
// reads at a glance ("1000 µF", "47 kΩ", "358 mC").

function significant(value: number, digits = 3): string {
  if (value === 0) return "0";
  const rounded = Number(value.toPrecision(digits));
  return Math.abs(rounded) >= 10 ** digits ? rounded.toFixed(0) : String(rounded);
}

const PREFIX_FACTORS: Record<string, number> = { M: 1e6, k: 1e3, "": 1, m: 1e-3, "µ": 1e-6, n: 1e-9 };

/** `prefixes` from largest to smallest, e.g. ["k", "", "m"]. */
function withPrefix(value: number, unit: string, prefixes: string[]): string {
  if (value === 0) return `0 ${unit}`;
  const chosen = prefixes.find((p) => Math.abs(value) >= (PREFIX_FACTORS[p] ?? 1)) ?? prefixes.at(-1) ?? "";
  return `${significant(value / (PREFIX_FACTORS[chosen] ?? 1))} ${chosen}${unit}`;
}

export const volts = (v: number) => `${significant(v)} V`;
export const joules = (j: number) => `${significant(j)} J`;
export const coulombs = (c: number) => withPrefix(c, "C", ["", "m", "µ"]);
export const farads = (f: number) => withPrefix(f, "F", ["µ", "n"]);
export const ohms = (r: number) => withPrefix(r, "Ω", ["M", "k", ""]);
/** Waits are stated in whole seconds, rounded up so the figure is never short. */
export const seconds = (s: number) => `${Math.ceil(s)} s`;
