"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { openShopForSeller, SellerError } from "@/db/queries/sellers";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import type { FormResult } from "@/lib/validations/auth";
import { shopFieldsSchema, type ShopFieldName } from "@/lib/validations/sellers";
import { readShopForm } from "@/components/sell/read-shop-form";

export async function openShop(_previous: FormResult<ShopFieldName> | null, form: FormData): Promise<FormResult<ShopFieldName>> {
  const { raw, values } = readShopForm(form);
  try {
    const user = await requireUser(["seller"]);
    const parsed = shopFieldsSchema.safeParse(raw);
    if (!parsed.success) {
      const fieldErrors: Partial<Record<ShopFieldName, string[]>> = {};
      for (const issue of parsed.error.issues) (fieldErrors[issue.path[0] as ShopFieldName] ??= []).push(issue.message);
      return { ok: false, message: "Some entries need fixing; they are marked beside each field.", fieldErrors, values };
    }
    await openShopForSeller(user.id, parsed.data);
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {}, values };
    if (error instanceof SellerError) return { ok: false, message: error.message, fieldErrors: error.field ? { [error.field]: [error.message] } : {}, values };
    console.error("[sell/shop] could not open the shop", error);
    return { ok: false, message: "The shop could not be opened just now; nothing was lost — try again.", fieldErrors: {}, values };
  }
  revalidatePath("/sell");
  redirect("/sell");
}
