"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { formatMoney } from "@/lib/format/money";
import type { FormResult } from "@/lib/validations/auth";

type Fields = "lineId" | "amount" | "reason";

export type RefundableLine = { id: string; title: string; refundableMinor: number };

/** A refund of part of one line; the amount is typed in major units and parsed exactly on the server. */
export function LineRefundForm({
  action,
  lines,
  currency,
}: {
  action: (previous: FormResult | null, formData: FormData) => Promise<FormResult<Fields>>;
  lines: RefundableLine[];
  currency: string;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  const code = currency.toUpperCase();
  return (
    <form action={formAction} className="space-y-4" noValidate data-testid="refund-form">
      <SelectField
        label="Line to refund"
        name="lineId"
        required
        error={failed?.fieldErrors.lineId}
        options={lines.map((l) => ({ value: l.id, label: `${l.title} — up to ${formatMoney(l.refundableMinor, code)}` }))}
      />
      <TextField label={`Amount (${code})`} name="amount" required inputMode="decimal" autoComplete="off" className="font-mono" placeholder="12.50" error={failed?.fieldErrors.amount} hint="In major units, e.g. 12.50; no more than is left on the line." />
      <TextArea label="Reason" name="reason" rows={2} required error={failed?.fieldErrors.reason} hint="The buyer reads this in the refund e-mail." />
      <FormMessage tone={state ? (state.ok ? "success" : "error") : "info"} message={state && (state.ok || Object.keys(state.fieldErrors).length === 0) ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Refunding…" : "Refund"}
      </Button>
    </form>
  );
}
