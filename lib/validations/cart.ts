import { z } from "zod";
import { MAX_LINE_QUANTITY } from "./cart-limits";

export { MAX_LINE_QUANTITY } from "./cart-limits";

const listingId = z.uuid({ message: "That item is not in the catalog." });

export const addToCartSchema = z.object({
  listingId,
  quantity: z.coerce
    .number({ message: "Enter how many you want." })
    .int("Enter a whole number.")
    .min(1, "Enter at least 1.")
    .max(MAX_LINE_QUANTITY, `At most ${MAX_LINE_QUANTITY} at a time.`)
    .default(1),
});

/** Quantity 0 removes the line. */
export const setCartQuantitySchema = z.object({
  listingId,
  quantity: z.coerce
    .number({ message: "Enter how many you want." })
    .int("Enter a whole number.")
    .min(0, "Enter 0 or more; 0 removes the item.")
    .max(MAX_LINE_QUANTITY, `At most ${MAX_LINE_QUANTITY} at a time.`),
});

export const removeFromCartSchema = z.object({ listingId });

export type AddToCartInput = z.infer<typeof addToCartSchema>;
export type SetCartQuantityInput = z.infer<typeof setCartQuantitySchema>;
