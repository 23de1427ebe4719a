// Number and date text that client components print while a page hydrates, without Intl.
//
// A browser loads its ICU data the first time a page touches Intl: about 20 ms of main thread on
// the project's 2-core test machine, 80 ms at Lighthouse's 4× mobile slowdown, inside the long
// task that hydrates the page. These
// functions give the same text as the Intl calls they stand for (the unit tests compare them with
// Intl over many values), and server and browser both use them, so hydration always matches.

/**
 * `value` (finite, ≥ 0) to at most `digits` significant digits, trailing zeros dropped, "." and no
 * grouping: what `new Intl.NumberFormat("en", { maximumSignificantDigits: digits, useGrouping:
 * false })` prints. Like Intl, it rounds the shortest decimal that reads back as the number
 * (1.005 → "1.01" at 3 digits), half away from zero, and never writes an exponent.
 */
export function formatSignificant(value: number, digits: number): string {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`formatSignificant takes a finite value ≥ 0, got ${value}`);
  if (!Number.isInteger(digits) || digits < 1 || digits > 21) throw new RangeError(`digits must be 1–21, got ${digits}`);
  if (value === 0) return "0";
  let { digits: mantissa, point } = shortestDecimal(value);
  if (mantissa.length > digits) {
    const up = mantissa.charCodeAt(digits) >= 53; // "5"
    mantissa = mantissa.slice(0, digits);
    if (up) {
      const carried = incrementDigits(mantissa);
      if (carried.length > mantissa.length) point += 1;
      mantissa = carried.slice(0, digits);
    }
  }
  mantissa = mantissa.replace(/0+$/, "") || "0";
  if (point <= 0) return `0.${"0".repeat(-point)}${mantissa}`;
  if (point >= mantissa.length) return mantissa + "0".repeat(point - mantissa.length);
  return `${mantissa.slice(0, point)}.${mantissa.slice(point)}`;
}

/** The digits of the shortest round-trip decimal of `value` (> 0) and where the point goes: 0.0123 → "123", -1. */
function shortestDecimal(value: number): { digits: string; point: number } {
  const [coefficient, exponent = "0"] = String(value).split("e");
  const [whole, fraction = ""] = coefficient!.split(".");
  const all = whole! + fraction;
  const leading = all.length - all.replace(/^0+/, "").length;
  return { digits: all.slice(leading).replace(/0+$/, "") || "0", point: whole!.length - leading + Number(exponent) };
}

/** "129" → "130", "999" → "1000". */
function incrementDigits(digits: string): string {
  const out = digits.split("");
  for (let i = out.length - 1; i >= 0; i--) {
    if (out[i] !== "9") {
      out[i] = String(Number(out[i]) + 1);
      return out.join("");
    }
    out[i] = "0";
  }
  return `1${out.join("")}`;
}

/** An integer with "," between thousands, as `n.toLocaleString("en")` (and "en-GB") prints it. */
export function groupThousands(n: number): string {
  if (!Number.isSafeInteger(n)) throw new RangeError(`groupThousands takes a safe integer, got ${n}`);
  const digits = String(Math.abs(n)).replace(/\B(?=(\d{3})+$)/g, ",");
  return n < 0 ? `-${digits}` : digits;
}

// CLDR's abbreviated month names for en-GB (September is "Sept" there, unlike en-US).
const MONTHS_GB = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sept", "Oct", "Nov", "Dec"];

/** "2 Dec 2026": `Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" })`. */
export function formatUtcDay(at: Date): string {
  if (Number.isNaN(at.getTime())) throw new RangeError("formatUtcDay takes a valid date");
  return `${at.getUTCDate()} ${MONTHS_GB[at.getUTCMonth()]} ${at.getUTCFullYear()}`;
}

/** "2 Dec 2026, 14:05": the same with `timeStyle: "short"` (24-hour clock, as en-GB has it). */
export function formatUtcDayTime(at: Date): string {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${formatUtcDay(at)}, ${pad(at.getUTCHours())}:${pad(at.getUTCMinutes())}`;
}
