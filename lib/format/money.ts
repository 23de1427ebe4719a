import { groupThousands } from "./plain";

// en-GB's currency signs (CLDR) for the currencies listings are priced in, all with two minor
// digits (lib/validations/listings.ts CURRENCIES); a code is followed by a no-break space.
const EN_GB_PREFIXES: Record<string, string> = {
  EUR: "€",
  GBP: "£",
  USD: "US$",
  CHF: "CHF\u00a0",
  SEK: "SEK\u00a0",
  PLN: "PLN\u00a0",
};

/**
 * Money is stored as an integer of minor units; this is the one place it becomes text.
 * How many minor digits a currency has comes from Intl (CLDR follows ISO 4217: EUR 2, JPY 0,
 * KWD 3), never from a hard-coded 100.
 */
export function formatMoney(minor: number, currency: string, locale = "en-GB"): string {
  if (!Number.isSafeInteger(minor)) throw new RangeError(`Money must be an integer of minor units, got ${minor}`);
  // The listing currencies in en-GB, without touching Intl (lib/format/plain.ts says why); the
  // unit tests compare this with Intl for every one of them.
  const prefix = locale === "en-GB" ? EN_GB_PREFIXES[currency] : undefined;
  if (prefix !== undefined) {
    const [units, cents] = toDecimalString(Math.abs(minor), 2).split(".");
    return `${minor < 0 ? "-" : ""}${prefix}${groupThousands(Number(units))}.${cents}`;
  }
  const format = new Intl.NumberFormat(locale, { style: "currency", currency });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(toDecimalString(minor, digits));
}

/** The amount in major units as an exact decimal string; Intl formats strings without float error. */
export function toDecimalString(minor: number, digits: number): `${number}` {
  const sign = minor < 0 ? "-" : "";
  const units = String(Math.abs(minor));
  if (digits === 0) return `${sign}${units}` as `${number}`;
  const padded = units.padStart(digits + 1, "0");
  return `${sign}${padded.slice(0, -digits)}.${padded.slice(-digits)}` as `${number}`;
}

/** Minor digits of a currency as Intl knows them, for inputs that take major units. */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
}
