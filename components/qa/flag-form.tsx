"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { fieldError, type QaFormAction } from "./form-helpers";

/** "Flag for a moderator", folded away until opened; once flagged it says so instead (the action redirects with its thanks). */
export function FlagForm({ action, kind, alreadyFlagged }: { action: QaFormAction; kind: "question" | "answer"; alreadyFlagged: boolean }) {
  const [state, formAction, pending] = useActionState(action, null);
  const [reason, setReason] = useState("");
  if (alreadyFlagged) {
    return (
      <p className="text-sm text-graphite-600" data-testid={`flagged-${kind}`}>
        You flagged this {kind}; a moderator will look at it.
      </p>
    );
  }
  return (
    <details className="text-sm" data-testid={`flag-${kind}`}>
      <summary className="cursor-pointer text-graphite-600 hover:text-graphite-900">Flag this {kind} for a moderator</summary>
      <form action={formAction} className="mt-2 max-w-reading space-y-2" aria-label={`Flag this ${kind}`}>
        <TextArea
          name="reason"
          label="What is wrong with it?"
          hint="Unsafe advice, abuse, spam, or off-topic. A moderator reads this; the author does not."
          rows={2}
          required
          maxLength={500}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          error={fieldError(state, "reason")}
        />
        <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
        <Button type="submit" variant="secondary" size="sm" disabled={pending}>
          {pending ? "Flagging…" : "Flag it"}
        </Button>
      </form>
    </details>
  );
}
