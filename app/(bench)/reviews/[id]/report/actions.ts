"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { deliverReport } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { reviewFailure } from "@/lib/reviews/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { reportSchema } from "@/lib/validations/reviews";

/** Reads the per-checkpoint fields (`verdict.<id>`, `comment.<id>`) and names each error after its field. */
export async function deliverReportAction(sessionId: string, _previous: FormResult | null, form: FormData): Promise<FormResult> {
  const ids = form.getAll("checkpoint").map(String);
  const values: Record<string, string> = { summaryMd: String(form.get("summaryMd") ?? "") };
  for (const id of ids) {
    values[`verdict.${id}`] = String(form.get(`verdict.${id}`) ?? "");
    values[`comment.${id}`] = String(form.get(`comment.${id}`) ?? "");
  }
  try {
    const user = await requireUser(["reviewer"]);
    const parsed = reportSchema.safeParse({
      verdicts: ids.map((id) => ({ checkpointId: id, verdict: values[`verdict.${id}`] || undefined, comment: values[`comment.${id}`] })),
      summaryMd: values.summaryMd,
    });
    if (!parsed.success) {
      const fieldErrors: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) {
        const [first, index, field] = issue.path;
        const id = first === "verdicts" && typeof index === "number" ? ids[index] : undefined;
        const key = id ? `${field === "comment" ? "comment" : "verdict"}.${id}` : String(first ?? "");
        (fieldErrors[key] ??= []).push(issue.message);
      }
      return { ok: false, message: "Some entries need fixing; they are marked beside each checkpoint. Nothing was delivered.", fieldErrors, values };
    }
    await deliverReport({ actor: user, sessionId, report: parsed.data });
  } catch (error) {
    return reviewFailure(error, "deliver", values);
  }
  revalidatePath("/reviews");
  revalidatePath(`/reviews/${sessionId}`);
  redirect(`/reviews/${sessionId}?done=delivered`);
}
