import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";

/**
 * What the checkout form sends: the sheet revision of every item the buyer ticked (`ack.<listingId>`)
 * and the total they were shown, so a price that changed meanwhile is caught before paying.
 */
export const startCheckoutSchema = z.object({
  acknowledgements: z.record(z.uuid(), z.coerce.number().int().positive()).default({}),
  shownTotalMinor: z.coerce.number().int().nonnegative().optional(),
  shownCurrency: z
    .string()
    .regex(/^[A-Z]{3}$/)
    .optional(),
});

export type StartCheckoutInput = z.infer<typeof startCheckoutSchema>;

/** Reads the form's fields into the schema's shape; unknown fields are ignored. */
export function checkoutFormInput(form: FormData): unknown {
  const acknowledgements: Record<string, string> = {};
  for (const [key, value] of form.entries()) {
    if (key.startsWith("ack.") && typeof value === "string") acknowledgements[key.slice(4)] = value;
  }
  const total = form.get("shownTotalMinor");
  const currency = form.get("shownCurrency");
  return {
    acknowledgements,
    ...(typeof total === "string" && total !== "" ? { shownTotalMinor: total } : {}),
    ...(typeof currency === "string" && currency !== "" ? { shownCurrency: currency } : {}),
  };
}

export const checkoutStatusQuerySchema = z.object({ session: z.string({ error: "Name the payment session." }).regex(NUL_FREE, NUL_ERROR).min(1, { error: "Name the payment session." }).max(255, { error: "That is not a payment session." }) });
