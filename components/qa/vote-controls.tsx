"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { QaFormAction } from "./form-helpers";

function Score({ score }: { score: number }) {
  return (
    <span className="font-mono text-lg tabular-nums" data-testid="answer-score" aria-label={`Score ${score}`}>
      {score}
    </span>
  );
}

/** The score alone, with why there is nothing to press (a visitor, or one's own answer). */
export function ScoreOnly({ score, note }: { score: number; note: string }) {
  return (
    <div className="flex flex-col items-center gap-1 text-center text-xs text-graphite-600">
      <Score score={score} />
      <span>{note}</span>
    </div>
  );
}

/** The answer's score with up and down votes; pressing the vote you already gave takes it back. */
export function VoteControls({ action, score, vote }: { action: QaFormAction; score: number; vote: -1 | 0 | 1 }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="flex flex-col items-center gap-1" aria-label="Vote on this answer">
      <Button type="submit" name="value" value={vote === 1 ? "0" : "1"} variant={vote === 1 ? "primary" : "secondary"} size="sm" aria-pressed={vote === 1} disabled={pending}>
        <span aria-hidden="true">▲</span>
        <span className="sr-only">{vote === 1 ? "Take back your up vote" : "Vote up"}</span>
      </Button>
      <Score score={score} />
      <Button type="submit" name="value" value={vote === -1 ? "0" : "-1"} variant={vote === -1 ? "primary" : "secondary"} size="sm" aria-pressed={vote === -1} disabled={pending}>
        <span aria-hidden="true">▼</span>
        <span className="sr-only">{vote === -1 ? "Take back your down vote" : "Vote down"}</span>
      </Button>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} className="max-w-40 text-center" />
    </form>
  );
}
