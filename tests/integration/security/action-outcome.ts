// What a server action's answer means in the access matrix's words (tests/support/access-matrix.ts).
import type { ActionOutcome } from "../../support/access-matrix";

export type ActionResult = { ok?: boolean; message?: string; fieldErrors?: Record<string, unknown> } | null | undefined;

export function classify(result: ActionResult): ActionOutcome {
  if (result === undefined || result?.ok === true) return "ok";
  const message = result?.message ?? "";
  // The guard's refusals (lib/auth/access.ts); the checkout words its own for a visitor.
  if (/^Sign in to continue\.$|^Sign in to pay/.test(message)) return "401";
  if (/^This needs the .+ role\.$/.test(message)) return "403";
  // Input validation answers with the form's general words and marks the fields; a refusal of the
  // operation (not yours, not now) may name a field too, but says why in its own words.
  const validation = /need fixing|marked beside|missing or out of range/i.test(message);
  return validation && Object.keys(result?.fieldErrors ?? {}).length > 0 ? "invalid" : "refused";
}

/** Calls the action; redirect() ends a successful one by throwing, anything else thrown is a test failure. */
export async function outcomeOf(call: () => Promise<unknown>): Promise<{ outcome: ActionOutcome; detail: string }> {
  try {
    const result = (await call()) as ActionResult;
    return { outcome: classify(result), detail: result?.message ?? "" };
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (digest.startsWith("NEXT_REDIRECT")) return { outcome: "ok", detail: digest.split(";")[2] ?? "" };
    throw error;
  }
}

/** Actions on scope captures run in capture-action-access.test.ts, whose world serves capture files; all others in action-access.test.ts. */
export const CAPTURE_ACTION_FILES = ["app/(bench)/bench/logs/[id]/capture-actions.ts", "app/(bench)/reviews/[id]/captures/[captureId]/actions.ts"];
