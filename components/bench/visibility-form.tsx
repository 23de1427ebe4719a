"use client";

import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { BenchFormResult } from "@/lib/validations/bench";

/** The owner's switch between private (the default) and public. */
export function VisibilityForm({ visibility, action }: { visibility: "private" | "public"; action: (next: unknown) => Promise<BenchFormResult> }) {
  const [result, setResult] = useState<BenchFormResult | null>(null);
  const [pending, startTransition] = useTransition();
  const next = visibility === "private" ? "public" : "private";
  return (
    <div className="space-y-2" data-testid="visibility-form">
      <p className="text-sm text-graphite-700">
        {visibility === "private"
          ? "Private: only you, the moderators and a reviewer who accepts a review you book can read it."
          : "Public: anyone with the link can read it, and you can link it from a question. Only you can change it."}
      </p>
      <Button
        variant="secondary"
        size="sm"
        disabled={pending}
        onClick={() => startTransition(async () => setResult(await action(next)))}
      >
        {next === "public" ? "Make it public" : "Make it private"}
      </Button>
      <FormMessage tone={result?.ok ? "success" : "error"} message={result?.message} />
    </div>
  );
}
