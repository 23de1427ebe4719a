"use server";

import { redirect } from "next/navigation";
import { signIn, signOut } from "@/lib/auth/config";
import { signInSchema, type FormResult } from "@/lib/validations/auth";

export async function requestSignInLink(_previous: FormResult<"email"> | null, formData: FormData): Promise<FormResult<"email">> {
  const parsed = signInSchema.safeParse({ email: formData.get("email"), next: formData.get("next") ?? undefined });
  const typed = String(formData.get("email") ?? "");
  if (!parsed.success) {
    return {
      ok: false,
      message: "Check the address and try again.",
      fieldErrors: { email: parsed.error.issues.map((i) => i.message) },
      values: { email: typed },
    };
  }
  let outcome: string | undefined;
  try {
    outcome = await signIn("resend", { email: parsed.data.email, redirectTo: parsed.data.next, redirect: false });
  } catch (error) {
    console.error("[sign-in] could not send the link:", error);
    outcome = "error=EmailSignin";
  }
  if (typeof outcome === "string" && outcome.includes("error=")) {
    return {
      ok: false,
      message: "We could not send the sign-in e-mail just now: the mail service is not answering. Nothing was lost — try again in a minute.",
      fieldErrors: {},
      values: { email: typed },
    };
  }
  redirect(`/sign-in/check-email?email=${encodeURIComponent(parsed.data.email)}`);
}

export async function signOutAction() {
  await signOut({ redirectTo: "/" });
}
