"use client";

import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/error-state";

export default function ReviewsError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <ErrorState
      title="Your reviews could not be shown"
      digest={error.digest}
      action={
        <Button variant="secondary" onClick={reset}>
          Try again
        </Button>
      }
    >
      Something failed on our side. Bookings, reports and held payments are stored and nothing was changed; try again in a moment.
    </ErrorState>
  );
}
