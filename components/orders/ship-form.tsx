"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

type Fields = "carrier" | "trackingRef";

export function ShipForm({ action }: { action: (previous: FormResult | null, formData: FormData) => Promise<FormResult<Fields>> }) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="space-y-4" noValidate data-testid="ship-form">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Carrier" name="carrier" required autoComplete="off" error={failed?.fieldErrors.carrier} hint="As printed on the label." />
        <TextField label="Tracking reference" name="trackingRef" required autoComplete="off" className="font-mono" error={failed?.fieldErrors.trackingRef} />
      </div>
      <FormMessage tone={state ? (state.ok ? "success" : "error") : "info"} message={state && (state.ok || Object.keys(state.fieldErrors).length === 0) ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : "Mark shipped"}
      </Button>
    </form>
  );
}
