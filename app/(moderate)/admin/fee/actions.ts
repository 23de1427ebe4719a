"use server";

import { revalidatePath } from "next/cache";
import { setPlatformFee } from "@/db/queries/orders";
import { requireUser } from "@/lib/auth/guard";
import { basisPointsToPercent } from "@/lib/orders/amount-input";
import { errorFormResult, zodFormResult } from "@/lib/orders/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { platformFeeSchema } from "@/lib/validations/orders";

export async function setPlatformFeeAction(_previous: FormResult | null, formData: FormData): Promise<FormResult<"percent">> {
  let message: string;
  try {
    const admin = await requireUser(["admin"]);
    const parsed = platformFeeSchema.safeParse({ percent: formData.get("percent") ?? "" });
    if (!parsed.success) return zodFormResult(parsed.error);
    const result = await setPlatformFee({ actorId: admin.id, feeBps: parsed.data.percent });
    message = result.changed
      ? `The fee is now ${basisPointsToPercent(result.toBps)} % (was ${basisPointsToPercent(result.fromBps)} %) for checkouts started from now on.`
      : `The fee is already ${basisPointsToPercent(result.toBps)} %; nothing changed.`;
  } catch (error) {
    return errorFormResult(error, "fee");
  }
  revalidatePath("/admin/fee");
  return { ok: true, message };
}
