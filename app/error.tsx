"use client";

import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/error-state";

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <ErrorState
      title="This page could not be shown"
      digest={error.digest}
      action={
        <Button variant="secondary" onClick={reset}>
          Try again
        </Button>
      }
    >
      Something failed on our side. Nothing you entered was saved half-way; try again, and if it keeps failing the reference
      below helps the operator find it in the log.
    </ErrorState>
  );
}
