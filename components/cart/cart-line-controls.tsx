"use client";

import { useActionState } from "react";
import { removeCartLineAction, updateCartLineAction } from "@/app/(shop)/cart/actions";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import { MAX_LINE_QUANTITY } from "@/lib/validations/cart-limits";

/** Quantity and remove for one cart line; the server caps the quantity by stock and says so. */
export function CartLineControls({ listingId, title, quantity, stock }: { listingId: string; title: string; quantity: number; stock: number }) {
  const [state, action, pending] = useActionState(updateCartLineAction, null);
  const inputId = `qty-${listingId}`;
  const error = state && !state.ok ? (state.fieldErrors.quantity?.join(" ") ?? state.message) : undefined;
  return (
    <div className="space-y-1">
      <div className="flex flex-wrap items-center gap-2">
        <form action={action} className="flex items-center gap-2">
          <input type="hidden" name="listingId" value={listingId} />
          <label htmlFor={inputId} className="sr-only">
            Quantity of {title}
          </label>
          <input
            id={inputId}
            name="quantity"
            type="number"
            inputMode="numeric"
            min={0}
            max={Math.max(1, Math.min(stock, MAX_LINE_QUANTITY))}
            step={1}
            defaultValue={quantity}
            key={quantity}
            aria-invalid={error ? true : undefined}
            className="figure h-8 w-16 rounded border border-graphite-300 bg-paper-raised px-2 text-right font-mono"
          />
          <Button type="submit" size="sm" variant="secondary" disabled={pending}>
            Update
          </Button>
        </form>
        <form action={removeCartLineAction}>
          <input type="hidden" name="listingId" value={listingId} />
          <Button type="submit" size="sm" variant="quiet" aria-label={`Remove ${title}`}>
            Remove
          </Button>
        </form>
      </div>
      <FormMessage tone={error ? "error" : "success"} message={error ?? (state?.ok ? state.message : undefined)} />
    </div>
  );
}
