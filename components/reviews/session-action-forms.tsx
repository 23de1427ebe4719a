"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

function errorOf(state: FormResult | null, field: string): string[] | undefined {
  return state && !state.ok ? state.fieldErrors[field] : undefined;
}

/** The reviewer's answer to a request: accept (the log is shared with them) or decline (the hold is released). */
export function RespondForms({ accept, decline }: { accept: Action; decline: Action }) {
  const [accepted, acceptAction, accepting] = useActionState(accept, null);
  const [declined, declineAction, declining] = useActionState(decline, null);
  return (
    <div className="grid gap-4 md:grid-cols-2" data-testid="respond-forms">
      <form action={acceptAction} className="space-y-2">
        <p className="text-sm text-graphite-700">Accepting shares the log with you and starts the clock for the report.</p>
        <FormMessage tone="error" message={accepted && !accepted.ok ? accepted.message : undefined} />
        <Button type="submit" disabled={accepting || declining}>
          {accepting ? "Accepting…" : "Accept the request"}
        </Button>
      </form>
      <form action={declineAction} className="space-y-2">
        <TextArea name="reason" label="Note to the builder (optional)" hint="Say why, or who might be better placed." rows={2} maxLength={1000} error={errorOf(declined, "reason")} />
        <FormMessage tone="error" message={declined && !declined.ok ? declined.message : undefined} />
        <Button type="submit" variant="secondary" disabled={accepting || declining}>
          {declining ? "Declining…" : "Decline"}
        </Button>
      </form>
    </div>
  );
}

/** The builder's dispute of a delivered report, within its 7 days. */
export function DisputeForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-2" data-testid="dispute-form">
      <TextArea
        name="reason"
        label="What is wrong with the report"
        hint="A moderator reads this and the report, then decides whether the payment stands or is refunded in part or in full."
        rows={3}
        maxLength={2000}
        required
        error={errorOf(state, "reason")}
      />
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? "Sending…" : "Dispute the report"}
      </Button>
    </form>
  );
}
