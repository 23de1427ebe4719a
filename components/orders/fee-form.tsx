"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { NumberField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

export function FeeForm({ action, currentPercent }: { action: (previous: FormResult | null, formData: FormData) => Promise<FormResult<"percent">>; currentPercent: string }) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="max-w-sm space-y-4" noValidate data-testid="fee-form">
      <NumberField label="Platform fee" name="percent" unit="%" min={0} max={50} step="0.01" required defaultValue={currentPercent} error={failed?.fieldErrors.percent} hint="0 to 50 %, up to two decimals (basis points)." />
      <FormMessage tone={state ? (state.ok ? "success" : "error") : "info"} message={state && (state.ok || !failed?.fieldErrors.percent) ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : "Save the fee"}
      </Button>
    </form>
  );
}
