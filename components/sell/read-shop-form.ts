import type { ShopFieldName } from "@/lib/validations/sellers";

const FIELDS: ShopFieldName[] = ["shopName", "profileMd", "country", "returnsPolicyMd", "returnsWindowDays"];

/** The shop fields of a posted form: `raw` for the schema, `values` (as typed) to refill the form. */
export function readShopForm(form: FormData): { raw: Record<ShopFieldName, string>; values: Partial<Record<ShopFieldName, string>> } {
  const raw = Object.fromEntries(FIELDS.map((f) => [f, String(form.get(f) ?? "")])) as Record<ShopFieldName, string>;
  return { raw, values: { ...raw } };
}
