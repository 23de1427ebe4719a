"use server";

import { revalidatePath } from "next/cache";
import { addToCart, removeFromCart, setCartQuantity, type CartChange } from "@/db/queries/cart";
import { getSessionUser } from "@/lib/auth/guard";
import { cartOwnerForWrite, currentCartOwner } from "@/lib/checkout/cart-owner";
import { addToCartSchema, removeFromCartSchema, setCartQuantitySchema } from "@/lib/validations/cart";
import type { FormResult } from "@/lib/validations/auth";

// Visitors have carts too, so these need no role: the owner is the member, or the visitor's cookie.

export type CartFormResult = FormResult<"quantity"> & { quantity?: number };

function refusal(change: Extract<CartChange, { ok: false }>): CartFormResult {
  const message =
    change.reason === "not-for-sale"
      ? "This item is no longer for sale."
      : change.reason === "out-of-stock"
        ? "This item is out of stock."
        : "That item is not in your cart any more.";
  return { ok: false, message, fieldErrors: {} };
}

export async function addToCartAction(_previous: CartFormResult | null, formData: FormData): Promise<CartFormResult> {
  const parsed = addToCartSchema.safeParse({ listingId: formData.get("listingId"), quantity: formData.get("quantity") ?? undefined });
  if (!parsed.success) {
    return { ok: false, message: "Check the quantity.", fieldErrors: { quantity: parsed.error.issues.map((i) => i.message) } };
  }
  const owner = await cartOwnerForWrite(await getSessionUser());
  const change = await addToCart(owner, parsed.data);
  if (!change.ok) return refusal(change);
  revalidatePath("/cart");
  return {
    ok: true,
    quantity: change.quantity,
    message: change.capped ? `That is all the stock there is: ${change.quantity} in your cart.` : `Added. ${change.quantity} in your cart.`,
  };
}

export async function updateCartLineAction(_previous: CartFormResult | null, formData: FormData): Promise<CartFormResult> {
  const parsed = setCartQuantitySchema.safeParse({ listingId: formData.get("listingId"), quantity: formData.get("quantity") });
  if (!parsed.success) {
    return { ok: false, message: "Check the quantity.", fieldErrors: { quantity: parsed.error.issues.map((i) => i.message) } };
  }
  const owner = await currentCartOwner(await getSessionUser());
  if (!owner) return { ok: false, message: "Your cart is empty.", fieldErrors: {} };
  const change = await setCartQuantity(owner, parsed.data);
  if (!change.ok) return refusal(change);
  revalidatePath("/cart");
  revalidatePath("/checkout");
  return {
    ok: true,
    quantity: change.quantity,
    message: change.capped ? `Only ${change.quantity} in stock; quantity set to ${change.quantity}.` : "Quantity updated.",
  };
}

export async function removeCartLineAction(formData: FormData): Promise<void> {
  const parsed = removeFromCartSchema.safeParse({ listingId: formData.get("listingId") });
  if (!parsed.success) return;
  const owner = await currentCartOwner(await getSessionUser());
  if (owner) await removeFromCart(owner, parsed.data.listingId);
  revalidatePath("/cart");
  revalidatePath("/checkout");
}
