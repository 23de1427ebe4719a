// Amounts people type in major units ("12.50") become integers of minor units without ever passing
// through a floating-point number, so 0.1 + 0.2 never shows up as a refund of 30.000000000000004 cents.

export type AmountParse = { ok: true; minor: number } | { ok: false; message: string };

const SHAPE = /^(\d+)(?:[.,](\d+))?$/;

/**
 * "12.50" with 2 minor digits → 1250. A decimal comma is accepted ("12,50"); thousands separators,
 * signs and more decimals than the currency has are refused rather than guessed at.
 */
export function parseMajorUnits(text: string, digits: number): AmountParse {
  const trimmed = text.trim().replace(/\s+/g, "");
  const match = SHAPE.exec(trimmed);
  if (!match) return { ok: false, message: digits > 0 ? "Enter an amount such as 12.50, without a currency sign or thousands separators." : "Enter a whole amount such as 1200." };
  const whole = match[1]!;
  const fraction = match[2] ?? "";
  if (fraction.length > digits) {
    return { ok: false, message: digits === 0 ? "This currency has no minor units; enter a whole amount." : `Use at most ${digits} digits after the decimal point.` };
  }
  const minor = Number(whole + fraction.padEnd(digits, "0"));
  if (!Number.isSafeInteger(minor)) return { ok: false, message: "That amount is too large." };
  return { ok: true, minor };
}

/** A percentage with up to two decimals ("8.25") as basis points (825): 1 % = 100 bp. */
export function parsePercentToBasisPoints(text: string): AmountParse {
  const parsed = parseMajorUnits(text.replace(/%$/, ""), 2);
  if (!parsed.ok) return { ok: false, message: "Enter a percentage such as 8 or 8.25." };
  return parsed;
}

/** Basis points as the percentage a person reads: 825 → "8.25", 800 → "8". */
export function basisPointsToPercent(bps: number): string {
  const whole = Math.trunc(bps / 100);
  const rest = String(bps % 100).padStart(2, "0").replace(/0+$/, "");
  return rest === "" ? String(whole) : `${whole}.${rest}`;
}
