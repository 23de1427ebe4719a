"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

/** Approve (the reviewer role and profile) or decline with a reason the applicant reads. */
export function VettingForms({ applicantName, approve, decline }: { applicantName: string; approve: Action; decline: Action }) {
  const [approved, approveAction, approving] = useActionState(approve, null);
  const [declined, declineAction, declining] = useActionState(decline, null);
  const reasonError = declined && !declined.ok ? declined.fieldErrors.reason : undefined;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <form action={approveAction} className="space-y-2" aria-label={`Approve ${applicantName}`}>
        <p className="text-sm text-graphite-700">Approving grants the reviewer role and makes the profile; the applicant is e-mailed and then connects a payout account.</p>
        <FormMessage tone="error" message={approved && !approved.ok ? approved.message : undefined} />
        <Button type="submit" disabled={approving || declining}>
          {approving ? "Approving…" : `Approve ${applicantName}`}
        </Button>
      </form>
      <form action={declineAction} className="space-y-2" aria-label={`Decline ${applicantName}`}>
        <TextArea name="reason" label="Reason for declining" hint="The applicant reads this." rows={2} maxLength={2000} error={reasonError} />
        <FormMessage tone="error" message={declined && !declined.ok ? declined.message : undefined} />
        <Button type="submit" variant="secondary" disabled={approving || declining}>
          {declining ? "Declining…" : "Decline"}
        </Button>
      </form>
    </div>
  );
}
