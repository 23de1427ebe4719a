"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { formatMoney } from "@/lib/format/money";

export type CheckoutStatusView = {
  id: string;
  status: "open" | "paid" | "expired" | "failed";
  currency: string;
  totalMinor: number;
  orders: { id: string; number: string; state: string; shopName: string; subtotalMinor: number }[];
};

// The provider's event normally arrives within a second or two; after this we stop asking every second.
const POLL_MS = 1_000;
const WAIT_LIMIT_MS = 30_000;

async function fetchStatus(sessionId: string): Promise<CheckoutStatusView> {
  const res = await fetch(`/api/checkout/status?session=${encodeURIComponent(sessionId)}`, { cache: "no-store" });
  if (!res.ok) throw new Error(`status ${res.status}`);
  return (await res.json()) as CheckoutStatusView;
}

/** "Paid" only once the verified webhook has marked it so; until then an honest "waiting". */
export function PaymentStatus({ sessionId, initial }: { sessionId: string; initial: CheckoutStatusView }) {
  const [waitedOut, setWaitedOut] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setWaitedOut(true), WAIT_LIMIT_MS);
    return () => clearTimeout(timer);
  }, []);
  const query = useQuery({
    queryKey: ["checkout-status", sessionId],
    queryFn: () => fetchStatus(sessionId),
    initialData: initial,
    staleTime: 0,
    refetchInterval: (q) => (q.state.data?.status === "open" && !waitedOut ? POLL_MS : false),
  });
  const status = query.data;

  if (status.status === "paid") {
    return (
      <div className="space-y-4" data-testid="payment-status" data-status="paid">
        <Alert tone="info" title="Payment received — order paid">
          We received {formatMoney(status.totalMinor, status.currency)}. A confirmation is on its way to your e-mail, and each seller has been told.
        </Alert>
        <ul className="space-y-1 text-sm">
          {status.orders.map((o) => (
            <li key={o.id} data-testid="paid-order">
              Order <span className="font-mono">{o.number}</span> from {o.shopName} — {formatMoney(o.subtotalMinor, status.currency)}
            </li>
          ))}
        </ul>
        <ButtonLink href="/orders">See your orders</ButtonLink>
      </div>
    );
  }
  if (status.status === "expired" || status.status === "failed") {
    return (
      <div className="space-y-4" data-testid="payment-status" data-status={status.status}>
        <Alert tone="stop" title={status.status === "expired" ? "The time to pay ran out" : "The payment did not go through"}>
          The stock held for you has been given back. If money was taken, it is refunded in full and you get an e-mail about it.
        </Alert>
        <ButtonLink href="/cart" variant="secondary">
          Back to your cart
        </ButtonLink>
      </div>
    );
  }
  return (
    <div className="space-y-4" data-testid="payment-status" data-status="open" aria-busy={!waitedOut}>
      <Alert tone="info" title="Waiting for the payment provider's confirmation">
        {waitedOut
          ? "The confirmation has not arrived yet. It usually comes within a minute; you will get an e-mail as soon as it does. Nothing is lost by leaving this page."
          : "Your order is marked paid only when the payment provider confirms the payment to us. This takes a few seconds."}
      </Alert>
      {waitedOut ? (
        <div className="flex gap-3">
          <Button variant="secondary" onClick={() => void query.refetch()}>
            Check again
          </Button>
          <Link href="/orders">Your orders</Link>
        </div>
      ) : null}
    </div>
  );
}
