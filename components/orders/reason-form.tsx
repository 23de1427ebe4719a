"use client";

import { useActionState } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

/** A form of one reason and a button: the buyer's return request, the seller's declined return. */
export function ReasonForm({
  action,
  label,
  hint,
  submitLabel,
  pendingLabel,
  variant = "primary",
  testId,
}: {
  action: (previous: FormResult | null, formData: FormData) => Promise<FormResult<"reason">>;
  label: string;
  hint?: string;
  submitLabel: string;
  pendingLabel: string;
  variant?: ButtonVariant;
  testId?: string;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  if (state?.ok) return <FormMessage tone="success" message={state.message} />;
  return (
    <form action={formAction} className="space-y-3" noValidate data-testid={testId}>
      <TextArea label={label} name="reason" rows={3} required hint={hint} error={failed?.fieldErrors.reason} />
      <FormMessage tone="error" message={failed && !failed.fieldErrors.reason ? failed.message : undefined} />
      <Button type="submit" variant={variant} disabled={pending}>
        {pending ? pendingLabel : submitLabel}
      </Button>
    </form>
  );
}
