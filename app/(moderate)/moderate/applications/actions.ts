"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { ApplicationError, approveApplication, declineApplication } from "@/db/queries/seller-applications";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { fieldErrorsFromZod } from "@/lib/http/json";
import type { FormResult } from "@/lib/validations/auth";
import { declineApplicationSchema } from "@/lib/validations/moderation";

async function moderator() {
  try {
    return { ok: true as const, user: await requireUser(["moderator"]) };
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false as const, result: { ok: false as const, message: error.message, fieldErrors: {} } };
    throw error;
  }
}

function refused(error: unknown): FormResult {
  if (error instanceof ApplicationError) return { ok: false, message: error.message, fieldErrors: {} };
  throw error;
}

export async function approveApplicationAction(applicationId: string, _previous: FormResult | null, _formData: FormData): Promise<FormResult> {
  const who = await moderator();
  if (!who.ok) return who.result;
  try {
    await approveApplication({ actor: who.user, applicationId });
  } catch (error) {
    return refused(error);
  }
  revalidatePath("/moderate", "layout");
  redirect("/moderate/applications?done=approved");
}

export async function declineApplicationAction(applicationId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  const who = await moderator();
  if (!who.ok) return who.result;
  const reason = String(formData.get("reason") ?? "");
  const parsed = declineApplicationSchema.safeParse({ reason });
  if (!parsed.success) return { ok: false, message: "Say why the application is declined.", fieldErrors: fieldErrorsFromZod(parsed.error), values: { reason } };
  try {
    await declineApplication({ actor: who.user, applicationId, reason: parsed.data.reason });
  } catch (error) {
    return { ...refused(error), values: { reason } } as FormResult;
  }
  revalidatePath("/moderate", "layout");
  redirect("/moderate/applications?done=declined");
}
