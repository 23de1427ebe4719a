"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

export function ConnectReviewerPayoutForm({ action, label }: { action: Action; label: string }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-2">
      <Button type="submit" disabled={pending}>
        {pending ? "Opening the payment provider…" : label}
      </Button>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}

export function AvailabilityForm({ action, available }: { action: Action; available: boolean }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-2">
      <input type="hidden" name="available" value={available ? "no" : "yes"} />
      <Button type="submit" variant="secondary" size="sm" disabled={pending}>
        {available ? "Pause new bookings" : "Take bookings again"}
      </Button>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}
