import { formatSignificant } from "@/lib/format/plain";

// SI prefixes from pico to tera (SI Brochure, 9th ed., table 7); centi, deci, deca and hecto are
// left out because engineering notation steps in powers of 1000.
const PREFIXES: Record<number, string> = {
  [-12]: "p",
  [-9]: "n",
  [-6]: "µ", // U+00B5 MICRO SIGN, which every latin font subset carries
  [-3]: "m",
  0: "",
  3: "k",
  6: "M",
  9: "G",
  12: "T",
};
const MIN_EXP = -12;
const MAX_EXP = 12;

// Units that never take a prefix: a "k%" or "m°C" means nothing.
const UNPREFIXED = new Set(["", "%", "‰", "ppm", "°", "°C", "K", "dB", "dBm"]);

// U+2212 MINUS SIGN, as ISO 80000-1 writes negative numbers; screen readers read it as "minus".
const MINUS = "−";

export type FormatSiOptions = { prefixes?: boolean };

// Figures use "." and no grouping whatever the page's locale, as datasheets do. Not Intl, which
// would cost the page its ICU load while it hydrates (lib/format/plain.ts).
const plain = formatSignificant;

/**
 * A value and its unit with an engineering SI prefix and `digits` significant digits, trailing
 * zeros dropped: formatSi(0.000047, "F") → "47 µF", formatSi(357.77, "V") → "358 V".
 * Non-finite values print as "∞ s" or "—", because an unbounded discharge time is a real answer.
 */
export function formatSi(value: number, unit: string, digits = 3, options: FormatSiOptions = {}): string {
  const spaced = (text: string, prefix = "") => (unit === "" && prefix === "" ? text : `${text} ${prefix}${unit}`);
  if (Number.isNaN(value)) return "—";
  const sign = value < 0 ? MINUS : "";
  const abs = Math.abs(value);
  if (abs === Infinity) return spaced(`${sign}∞`);
  if (abs === 0) return spaced("0");
  if (options.prefixes === false || UNPREFIXED.has(unit)) return spaced(sign + plain(abs, digits));

  let exp = Math.min(MAX_EXP, Math.max(MIN_EXP, Math.floor(Math.log10(abs) / 3) * 3));
  // Rounding can carry into the next prefix (999.7 → "1000"), and log10 can land a hair off.
  if (Number(plain(abs / 10 ** exp, digits)) >= 1000 && exp < MAX_EXP) exp += 3;
  const mantissa = abs / 10 ** exp;
  return spaced(sign + plain(mantissa, digits), PREFIXES[exp] ?? "");
}
