"use client";

import { useActionState } from "react";
import { connectPayoutAccount } from "@/app/(sell)/sell/actions";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";

export function ConnectPayoutForm({ label }: { label: string }) {
  const [state, action, pending] = useActionState(connectPayoutAccount, null);
  return (
    <form action={action} className="space-y-2">
      <Button type="submit" disabled={pending}>
        {pending ? "Opening the payment provider…" : label}
      </Button>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
    </form>
  );
}
