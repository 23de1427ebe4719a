"use client";

import { useState, useTransition } from "react";
import { retireListingAction } from "@/app/(sell)/sell/listings/actions";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";

/** Withdraws the listing for good, after a confirmation step on the page itself. */
export function RetireButton({ listingId }: { listingId: string }) {
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<string | undefined>();
  const [pending, startTransition] = useTransition();
  return (
    <div className="space-y-2">
      {confirming ? (
        <div className="flex flex-wrap items-center gap-2">
          <span className="text-sm">Retire it? It leaves the catalog and cannot be edited again.</span>
          <Button
            variant="danger"
            size="sm"
            disabled={pending}
            onClick={() =>
              startTransition(async () => {
                const result = await retireListingAction(listingId);
                if (result && !result.ok) setMessage(result.message);
              })
            }
          >
            Yes, retire the listing
          </Button>
          <Button variant="quiet" size="sm" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <Button variant="secondary" size="sm" onClick={() => setConfirming(true)}>
          Retire listing
        </Button>
      )}
      <FormMessage tone="error" message={message} />
    </div>
  );
}
