"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import { typed, type ModerationFormAction } from "./listing-action-forms";

function message(state: FormResult | null) {
  return <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />;
}

export function ApplicationDecisionForms({ shopName, approve, decline }: { shopName: string; approve: ModerationFormAction; decline: ModerationFormAction }) {
  const [approved, approveAction, approving] = useActionState(approve, null);
  const [declined, declineAction, declining] = useActionState(decline, null);
  const reasonError = declined && !declined.ok ? (declined.fieldErrors as Record<string, string[] | undefined>).reason : undefined;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <form action={approveAction} className="space-y-2" aria-label={`Approve ${shopName}`}>
        <p className="text-sm text-graphite-700">Approving grants the seller role and opens the shop; the applicant is e-mailed.</p>
        {message(approved)}
        <Button type="submit" disabled={approving || declining}>
          {approving ? "Approving…" : `Approve “${shopName}”`}
        </Button>
      </form>
      <form action={declineAction} className="space-y-2" aria-label={`Decline ${shopName}`}>
        <TextArea key={typed(declined, "reason")} defaultValue={typed(declined, "reason")} name="reason" label="Reason for declining" hint="The applicant reads this." rows={2} maxLength={2000} error={reasonError} />
        {message(declined)}
        <Button type="submit" variant="secondary" disabled={approving || declining}>
          {declining ? "Declining…" : "Decline"}
        </Button>
      </form>
    </div>
  );
}
