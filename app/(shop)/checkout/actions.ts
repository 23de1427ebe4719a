"use server";

import { redirect } from "next/navigation";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { revalidateCheckoutListingPages } from "@/lib/listings/listing-pages";
import { startCheckout } from "@/lib/payments/checkout";
import { checkoutFormInput, startCheckoutSchema } from "@/lib/validations/checkout";

export type CheckoutFormResult = { ok: false; message: string; code?: string; fieldErrors: Record<string, string[]> } | null;

export async function startCheckoutAction(_previous: CheckoutFormResult, formData: FormData): Promise<CheckoutFormResult> {
  let user;
  try {
    user = await requireUser();
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: "Sign in to pay; your cart is kept.", fieldErrors: {} };
    throw error;
  }
  if (!user.email) return { ok: false, message: "Your account has no e-mail address for the receipt.", fieldErrors: {} };
  const parsed = startCheckoutSchema.safeParse(checkoutFormInput(formData));
  if (!parsed.success) return { ok: false, message: "Reload the page and try again.", fieldErrors: {} };

  const result = await startCheckout({ id: user.id, email: user.email }, parsed.data);
  if (!result.ok) return { ok: false, message: result.message, code: result.code, fieldErrors: result.fieldErrors };
  // The stock is reserved now: the listing pages show what is left.
  await revalidateCheckoutListingPages(result.checkoutId);
  // The provider's hosted page; outside any try so Next can carry out the redirect.
  redirect(result.url);
}
