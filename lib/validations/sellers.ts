/**
 * Shared schemas for becoming a seller: the application a member sends and, for a seller whose
 * role was granted directly, the shop profile they fill in. Used by the client form and the server.
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";

/** ISO 3166-1 alpha-2: every officially assigned code. */
export const COUNTRY_CODES = [
  "AD", "AE", "AF", "AG", "AI", "AL", "AM", "AO", "AQ", "AR", "AS", "AT", "AU", "AW", "AX", "AZ",
  "BA", "BB", "BD", "BE", "BF", "BG", "BH", "BI", "BJ", "BL", "BM", "BN", "BO", "BQ", "BR", "BS", "BT", "BV", "BW", "BY", "BZ",
  "CA", "CC", "CD", "CF", "CG", "CH", "CI", "CK", "CL", "CM", "CN", "CO", "CR", "CU", "CV", "CW", "CX", "CY", "CZ",
  "DE", "DJ", "DK", "DM", "DO", "DZ", "EC", "EE", "EG", "EH", "ER", "ES", "ET", "FI", "FJ", "FK", "FM", "FO", "FR",
  "GA", "GB", "GD", "GE", "GF", "GG", "GH", "GI", "GL", "GM", "GN", "GP", "GQ", "GR", "GS", "GT", "GU", "GW", "GY",
  "HK", "HM", "HN", "HR", "HT", "HU", "ID", "IE", "IL", "IM", "IN", "IO", "IQ", "IR", "IS", "IT", "JE", "JM", "JO", "JP",
  "KE", "KG", "KH", "KI", "KM", "KN", "KP", "KR", "KW", "KY", "KZ", "LA", "LB", "LC", "LI", "LK", "LR", "LS", "LT", "LU", "LV", "LY",
  "MA", "MC", "MD", "ME", "MF", "MG", "MH", "MK", "ML", "MM", "MN", "MO", "MP", "MQ", "MR", "MS", "MT", "MU", "MV", "MW", "MX", "MY", "MZ",
  "NA", "NC", "NE", "NF", "NG", "NI", "NL", "NO", "NP", "NR", "NU", "NZ", "OM",
  "PA", "PE", "PF", "PG", "PH", "PK", "PL", "PM", "PN", "PR", "PS", "PT", "PW", "PY", "QA", "RE", "RO", "RS", "RU", "RW",
  "SA", "SB", "SC", "SD", "SE", "SG", "SH", "SI", "SJ", "SK", "SL", "SM", "SN", "SO", "SR", "SS", "ST", "SV", "SX", "SY", "SZ",
  "TC", "TD", "TF", "TG", "TH", "TJ", "TK", "TL", "TM", "TN", "TO", "TR", "TT", "TV", "TW", "TZ",
  "UA", "UG", "UM", "US", "UY", "UZ", "VA", "VC", "VE", "VG", "VI", "VN", "VU", "WF", "WS", "YE", "YT", "ZA", "ZM", "ZW",
] as const;
export type CountryCode = (typeof COUNTRY_CODES)[number];

/** Codes with their English names, sorted by name, for the country select. */
export function countryOptions(locale = "en"): { value: CountryCode; label: string }[] {
  const names = new Intl.DisplayNames([locale], { type: "region" });
  return COUNTRY_CODES.map((code) => ({ value: code, label: names.of(code) ?? code })).sort((a, b) => a.label.localeCompare(b.label, locale));
}

export const shopFieldsSchema = z.object({
  shopName: z
    .string({ error: "Give your shop a name." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "A shop name needs at least 3 characters." })
    .max(60, { error: "Keep the shop name under 60 characters." }),
  profileMd: z
    .string({ error: "Write a short profile." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(20, { error: "Write at least a couple of sentences about what you make (20 characters or more)." })
    .max(4000, { error: "Keep the profile under 4000 characters." }),
  country: z.enum(COUNTRY_CODES, { error: "Choose the country you ship from." }),
  returnsPolicyMd: z
    .string({ error: "Describe your returns policy." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(20, { error: "Describe your returns policy in a sentence or two (20 characters or more)." })
    .max(4000, { error: "Keep the returns policy under 4000 characters." }),
  returnsWindowDays: z.coerce
    .number({ error: "Enter the returns window as a whole number of days." })
    .int({ error: "Enter the returns window as a whole number of days." })
    .min(0, { error: "The returns window cannot be negative." })
    .max(365, { error: "Keep the returns window within a year (365 days)." }),
});
export type ShopFields = z.output<typeof shopFieldsSchema>;
export type ShopFieldName = keyof ShopFields;

export const sellerApplicationSchema = shopFieldsSchema;

/** A URL-safe handle from a shop name: "Larkspur Coil & Core" → "larkspur-coil-core". */
export function slugify(text: string): string {
  const slug = text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/g, "");
  return slug === "" ? "shop" : slug;
}
