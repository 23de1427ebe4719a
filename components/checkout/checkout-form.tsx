"use client";

import { useActionState } from "react";
import { startCheckoutAction } from "@/app/(shop)/checkout/actions";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { CheckboxField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { formatMoney } from "@/lib/format/money";

export type AcknowledgementItem = { listingId: string; title: string; sheetRevision: number; text: string; sheetHref: string };

/**
 * The acknowledgements and the "Pay" button. Each box carries the sheet revision the buyer read;
 * the server checks every mains-connected item was ticked at its current revision.
 */
export function CheckoutForm({ items, totalMinor, currency }: { items: AcknowledgementItem[]; totalMinor: number; currency: string }) {
  const [state, action, pending] = useActionState(startCheckoutAction, null);
  const provider = state?.code === "provider";
  return (
    <form action={action} className="space-y-6" data-testid="checkout-form">
      <input type="hidden" name="shownTotalMinor" value={totalMinor} />
      <input type="hidden" name="shownCurrency" value={currency} />
      {items.length > 0 ? (
        <fieldset className="max-w-reading space-y-4 rounded-md border border-amber-500 bg-amber-50/40 p-4">
          <legend className="px-1 font-semibold text-graphite-900">Safety sheets to acknowledge</legend>
          <p className="text-sm text-graphite-700">
            These items connect to mains. Read each safety sheet, then confirm below; your order records the sheet revision you read.
          </p>
          {items.map((item) => (
            <div key={item.listingId} data-testid="acknowledgement" data-listing={item.listingId}>
              <CheckboxField
                name={`ack.${item.listingId}`}
                value={String(item.sheetRevision)}
                required
                label={item.text}
                hint={
                  <a href={item.sheetHref} target="_blank" rel="noopener">
                    Read the safety sheet of {item.title} (revision {item.sheetRevision})
                  </a>
                }
                error={state?.fieldErrors[`ack.${item.listingId}`]}
              />
            </div>
          ))}
        </fieldset>
      ) : null}
      {provider ? (
        <Alert tone="stop" title="Payment not started">
          {state.message}
        </Alert>
      ) : (
        <FormMessage tone="error" message={state?.message} />
      )}
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Opening the payment page…" : `Pay ${formatMoney(totalMinor, currency)}`}
      </Button>
      <p className="text-sm text-graphite-600">You pay on the payment provider&apos;s page. The stock is held for you for 30 minutes.</p>
    </form>
  );
}
