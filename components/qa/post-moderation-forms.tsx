"use client";

import { useActionState, useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import { fieldError } from "./form-helpers";

export type BoundPostAction = (previous: FormResult | null, formData: FormData) => Promise<FormResult>;

export const POST_QUEUE_QUERY_KEY = ["post-queue"] as const;

/** The server action, then a refetch of the queue once it succeeded, so the item leaves the list. */
function useQueueAction(action: BoundPostAction) {
  const queryClient = useQueryClient();
  return useActionState(async (previous: FormResult | null, formData: FormData) => {
    const result = await action(previous, formData);
    if (result.ok) await queryClient.invalidateQueries({ queryKey: POST_QUEUE_QUERY_KEY });
    return result;
  }, null);
}

function Result({ state }: { state: FormResult | null }) {
  return <FormMessage tone={state ? (state.ok ? "success" : "error") : "info"} message={state?.message} />;
}

export function OneClickPostForm({ action, label, pendingLabel, variant = "primary" }: { action: BoundPostAction; label: string; pendingLabel: string; variant?: "primary" | "secondary" }) {
  const [state, formAction, pending] = useQueueAction(action);
  return (
    <form action={formAction} className="space-y-2">
      <Button type="submit" variant={variant} size="sm" disabled={pending}>
        {pending ? pendingLabel : label}
      </Button>
      <Result state={state} />
    </form>
  );
}

export function RemovePostForm({ action, kind }: { action: BoundPostAction; kind: "question" | "answer" }) {
  const [state, formAction, pending] = useQueueAction(action);
  const [reason, setReason] = useState("");
  return (
    <form action={formAction} className="space-y-2" aria-label={`Remove this ${kind}`}>
      <TextArea
        name="reason"
        label="Why is it removed?"
        hint="The author is e-mailed this reason."
        rows={2}
        required
        maxLength={2000}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        error={fieldError(state, "reason")}
      />
      <Button type="submit" variant="danger" size="sm" disabled={pending}>
        {pending ? "Removing…" : `Remove the ${kind}`}
      </Button>
      <Result state={state} />
    </form>
  );
}
