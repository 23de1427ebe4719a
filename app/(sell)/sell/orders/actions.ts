"use server";

import { revalidatePath } from "next/cache";
import { acceptReturn, declineReturn, markDelivered, refundCurrencyFor, refundLine, shipOrder, type RefundOutcome } from "@/db/queries/orders";
import { requireUser } from "@/lib/auth/guard";
import { formatMoney } from "@/lib/format/money";
import { cancelOrderAndRefresh } from "@/lib/orders/cancel";
import { errorFormResult, zodFormResult } from "@/lib/orders/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { declineReturnSchema, lineRefundSchema, shipOrderSchema } from "@/lib/validations/orders";

// The seller's order actions. Each is bound to its order id on the page; the id is not trusted for
// anything but naming the order: the query checks that the signed-in seller owns it.

function revalidateOrder(orderId: string) {
  revalidatePath("/sell/orders");
  revalidatePath(`/sell/orders/${orderId}`);
  revalidatePath(`/orders/${orderId}`);
  revalidatePath("/orders");
}

function refundSummary(outcomes: RefundOutcome[], currency: string): FormResult {
  const sum = (status: RefundOutcome["status"]) => outcomes.filter((o) => o.status === status).reduce((s, o) => s + o.amountMinor, 0);
  const failed = outcomes.find((o) => o.status === "failed");
  if (failed) return { ok: false, message: failed.message ?? "The payment service refused the refund.", fieldErrors: {} };
  if (sum("pending") > 0) return { ok: true, message: `${formatMoney(sum("pending"), currency)} is recorded and will be refunded as soon as the payment service answers.` };
  return { ok: true, message: outcomes.length ? `${formatMoney(sum("refunded"), currency)} refunded to the buyer.` : "Nothing was left to refund." };
}

export async function shipOrderAction(orderId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult<"carrier" | "trackingRef">> {
  try {
    const user = await requireUser(["seller"]);
    const parsed = shipOrderSchema.safeParse({ carrier: formData.get("carrier") ?? "", trackingRef: formData.get("trackingRef") ?? "" });
    if (!parsed.success) return zodFormResult(parsed.error);
    await shipOrder({ orderId, actorId: user.id, ...parsed.data });
  } catch (error) {
    return errorFormResult(error, "ship");
  }
  revalidateOrder(orderId);
  return { ok: true, message: "Marked shipped; the buyer has been e-mailed the tracking reference." };
}

export async function markDeliveredAction(orderId: string): Promise<FormResult> {
  try {
    const user = await requireUser(["seller"]);
    await markDelivered({ orderId, actorId: user.id });
  } catch (error) {
    return errorFormResult(error, "deliver");
  }
  revalidateOrder(orderId);
  return { ok: true, message: "Marked delivered." };
}

export async function cancelOrderAction(orderId: string, currency: string): Promise<FormResult> {
  let result: FormResult;
  try {
    const user = await requireUser(["seller"]);
    const cancelled = await cancelOrderAndRefresh({ orderId, actorId: user.id });
    const money = refundSummary(cancelled.refunds, currency);
    result = { ok: true, message: `Order cancelled and its stock put back. ${money.message ?? ""}`.trim() };
  } catch (error) {
    return errorFormResult(error, "cancel");
  }
  revalidateOrder(orderId);
  return result;
}

export async function refundLineAction(orderId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult<"lineId" | "amount" | "reason">> {
  let result: FormResult<"lineId" | "amount" | "reason">;
  try {
    const user = await requireUser(["seller"]);
    const currency = await refundCurrencyFor(orderId, user.id);
    const parsed = lineRefundSchema(currency).safeParse({ lineId: formData.get("lineId") ?? "", amount: formData.get("amount") ?? "", reason: formData.get("reason") ?? "" });
    if (!parsed.success) return zodFormResult(parsed.error);
    const outcome = await refundLine({ orderId, lineId: parsed.data.lineId, actorId: user.id, amountMinor: parsed.data.amount, reason: parsed.data.reason });
    result = refundSummary([outcome], currency);
  } catch (error) {
    return errorFormResult(error, "refund");
  }
  revalidateOrder(orderId);
  return result;
}

export async function acceptReturnAction(orderId: string, returnId: string, currency: string): Promise<FormResult> {
  let result: FormResult;
  try {
    const user = await requireUser(["seller"]);
    const accepted = await acceptReturn({ orderId, returnId, actorId: user.id });
    const money = refundSummary(accepted.refunds, currency);
    result = { ...money, message: `Return accepted. ${money.message ?? ""}`.trim() } as FormResult;
  } catch (error) {
    return errorFormResult(error, "accept-return");
  }
  revalidateOrder(orderId);
  return result;
}

export async function declineReturnAction(orderId: string, returnId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult<"reason">> {
  try {
    const user = await requireUser(["seller"]);
    const parsed = declineReturnSchema.safeParse({ reason: formData.get("reason") ?? "" });
    if (!parsed.success) return zodFormResult(parsed.error);
    await declineReturn({ orderId, returnId, actorId: user.id, reason: parsed.data.reason });
  } catch (error) {
    return errorFormResult(error, "decline-return");
  }
  revalidateOrder(orderId);
  return { ok: true, message: "Return declined; the buyer has been told why." };
}
