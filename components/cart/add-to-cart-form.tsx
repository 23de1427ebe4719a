"use client";

import Link from "next/link";
import { useActionState } from "react";
import { addToCartAction } from "@/app/(shop)/cart/actions";
import { Button } from "@/components/ui/button";
import { NumberField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { MAX_LINE_QUANTITY } from "@/lib/validations/cart-limits";

/** The listing page's "Add to cart": the quantity is capped by stock on the server as well. */
export function AddToCartForm({ listingId, stock }: { listingId: string; stock: number }) {
  const [state, action, pending] = useActionState(addToCartAction, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={action} className="space-y-3" data-testid="add-to-cart">
      <input type="hidden" name="listingId" value={listingId} />
      <div className="flex flex-wrap items-end gap-3">
        <div className="w-28">
          <NumberField label="Quantity" name="quantity" defaultValue={1} min={1} max={Math.min(stock, MAX_LINE_QUANTITY)} step={1} error={failed?.fieldErrors.quantity} />
        </div>
        <Button type="submit" disabled={pending}>
          {pending ? "Adding…" : "Add to cart"}
        </Button>
      </div>
      <FormMessage
        tone={state?.ok ? "success" : "error"}
        message={
          state?.ok ? (
            <>
              {state.message} <Link href="/cart">View your cart</Link>
            </>
          ) : failed && !failed.fieldErrors.quantity ? (
            failed.message
          ) : undefined
        }
      />
    </form>
  );
}
