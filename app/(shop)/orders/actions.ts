"use server";

import { revalidatePath } from "next/cache";
import { markDelivered, requestReturn } from "@/db/queries/orders";
import { requireUser } from "@/lib/auth/guard";
import { errorFormResult, zodFormResult } from "@/lib/orders/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { returnRequestSchema } from "@/lib/validations/orders";

// The buyer's order actions, bound to the order id on the page; the query checks the buyer owns it.

function revalidateOrder(orderId: string) {
  revalidatePath("/orders");
  revalidatePath(`/orders/${orderId}`);
  revalidatePath(`/sell/orders/${orderId}`);
  revalidatePath("/sell/orders");
}

export async function confirmDeliveryAction(orderId: string): Promise<FormResult> {
  try {
    const user = await requireUser();
    await markDelivered({ orderId, actorId: user.id });
  } catch (error) {
    return errorFormResult(error, "confirm-delivery");
  }
  revalidateOrder(orderId);
  return { ok: true, message: "Thank you — the order is marked delivered." };
}

export async function requestReturnAction(orderId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult<"reason">> {
  try {
    const user = await requireUser();
    const parsed = returnRequestSchema.safeParse({ reason: formData.get("reason") ?? "" });
    if (!parsed.success) return zodFormResult(parsed.error);
    await requestReturn({ orderId, actorId: user.id, reason: parsed.data.reason });
  } catch (error) {
    return errorFormResult(error, "request-return");
  }
  revalidateOrder(orderId);
  return { ok: true, message: "Your return request has been sent to the seller; you will get their answer by e-mail." };
}
