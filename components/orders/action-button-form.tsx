"use client";

import { useActionState, useState } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { CheckboxField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

export type ActionButtonFormProps = {
  action: () => Promise<FormResult>;
  label: string;
  pendingLabel: string;
  variant?: ButtonVariant;
  /** a checkbox the person ticks first, for actions that cannot be undone */
  confirm?: string;
  testId?: string;
};

/** A one-click order action (confirm delivery, cancel, accept a return) with its result announced. */
export function ActionButtonForm({ action, label, pendingLabel, variant = "primary", confirm, testId }: ActionButtonFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  const [confirmed, setConfirmed] = useState(false);
  return (
    <form action={formAction} className="space-y-3" data-testid={testId}>
      {confirm ? <CheckboxField label={confirm} checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} /> : null}
      <Button type="submit" variant={variant} disabled={pending || (confirm !== undefined && !confirmed)}>
        {pending ? pendingLabel : label}
      </Button>
      <FormMessage tone={state ? (state.ok ? "success" : "error") : "info"} message={state?.message} />
    </form>
  );
}
