"use server";

import { revalidatePath } from "next/cache";
import { createApplication, SellerError } from "@/db/queries/sellers";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import type { FormResult } from "@/lib/validations/auth";
import { sellerApplicationSchema, type ShopFieldName } from "@/lib/validations/sellers";
import { readShopForm } from "@/components/sell/read-shop-form";

export async function applyToSell(_previous: FormResult<ShopFieldName> | null, form: FormData): Promise<FormResult<ShopFieldName>> {
  const { raw, values } = readShopForm(form);
  try {
    const user = await requireUser();
    const parsed = sellerApplicationSchema.safeParse(raw);
    if (!parsed.success) {
      const fieldErrors: Partial<Record<ShopFieldName, string[]>> = {};
      for (const issue of parsed.error.issues) (fieldErrors[issue.path[0] as ShopFieldName] ??= []).push(issue.message);
      return { ok: false, message: "Some entries need fixing; they are marked beside each field.", fieldErrors, values };
    }
    await createApplication(user.id, parsed.data);
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {}, values };
    if (error instanceof SellerError) return { ok: false, message: error.message, fieldErrors: error.field ? { [error.field]: [error.message] } : {}, values };
    console.error("[become-a-seller] could not record the application", error);
    return { ok: false, message: "The application could not be sent just now; nothing was lost — try again.", fieldErrors: {}, values };
  }
  revalidatePath("/account/become-a-seller");
  return { ok: true, message: "Application sent. A moderator reads it; you will hear by e-mail." };
}
