"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

const OUTCOMES = [
  { value: "payment_stands", label: "Close — the payment stands" },
  { value: "refund_full", label: "Refund in full" },
  { value: "refund_partial", label: "Refund in part" },
] as const;

/** The moderator's decision on a disputed review; a part refund takes an amount in euros. */
export function SettleDisputeForm({ action, priceText }: { action: Action; priceText: string }) {
  const [state, formAction, pending] = useActionState(action, null);
  const [outcome, setOutcome] = useState<string>("payment_stands");
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="space-y-3" data-testid="settle-dispute-form">
      <fieldset className="space-y-1.5">
        <legend className="text-sm font-semibold text-graphite-900">Decision</legend>
        {OUTCOMES.map((o) => (
          <label key={o.value} className="flex items-center gap-2 text-sm">
            <input type="radio" name="outcome" value={o.value} checked={outcome === o.value} onChange={() => setOutcome(o.value)} className="accent-copper-600" />
            {o.label}
          </label>
        ))}
      </fieldset>
      {outcome === "refund_partial" ? (
        <TextField name="amount" label="Amount to refund (EUR)" hint={`Less than the ${priceText} paid, e.g. 15.00.`} inputMode="decimal" className="max-w-40 font-mono" error={failed?.fieldErrors.amount} />
      ) : null}
      <TextArea name="note" label="Your decision, in words" hint="Both the builder and the reviewer read this." rows={3} maxLength={2000} required error={failed?.fieldErrors.note} />
      <FormMessage tone="error" message={failed?.message} />
      <Button type="submit" disabled={pending}>
        {pending ? "Settling…" : "Settle the dispute"}
      </Button>
    </form>
  );
}
