"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { signIn, signOut } from "@/lib/auth/config";
import { consumeRateLimit, describeRetry, type RateLimitDecision } from "@/lib/rate-limit";
import { addressRefusal, clientAddress, clientRefusal, signInAddressLimit, signInClientLimit } from "@/lib/rate-limit/sign-in";
import { signInSchema, type FormResult } from "@/lib/validations/auth";

/** Counts the request against the address and the client; the refusal to show when either is over, else null. */
async function signInRefusal(email: string): Promise<string | null> {
  const request = await headers();
  const client = clientAddress(request.get("x-forwarded-for"), request.get("x-real-ip"));
  const byAddress = await consumeRateLimit(signInAddressLimit(email));
  const byClient: RateLimitDecision | null = client ? await consumeRateLimit(signInClientLimit(client)) : null;
  const now = new Date();
  if (!byAddress.allowed) return addressRefusal(describeRetry(byAddress.resetAt, now));
  if (byClient && !byClient.allowed) return clientRefusal(describeRetry(byClient.resetAt, now));
  return null;
}

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
  // Before anything is sent: a refused request sends no mail.
  const refusal = await signInRefusal(parsed.data.email);
  if (refusal) return { ok: false, message: refusal, fieldErrors: {}, values: { email: typed } };
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
