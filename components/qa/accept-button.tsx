"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";

/** The asker's control on each answer: accept it, or take the acceptance back. */
export function AcceptButton({ action, accepted }: { action: (previous: FormResult | null) => Promise<FormResult>; accepted: boolean }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-1">
      <Button type="submit" variant={accepted ? "secondary" : "quiet"} size="sm" disabled={pending}>
        {accepted ? "Take back the acceptance" : "Accept this answer"}
      </Button>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}
