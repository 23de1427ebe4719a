import { ProductStateBadge } from "@/components/ui/state-badge";
import { formatMoney } from "@/lib/format/money";
import { orderTimeline, type TimelineEvent, type TimelineInput } from "@/lib/orders/timeline";
import { formatOrderDateTime } from "./format";

const WORDS: Record<TimelineEvent["kind"], string> = {
  placed: "Order placed",
  paid: "Payment received",
  shipped: "Shipped",
  delivered: "Delivered",
  cancelled: "Cancelled by the seller",
  refund: "Refund sent",
  refund_pending: "Refund recorded, waiting for the payment service",
  return_requested: "Return requested",
  return_accepted: "Return accepted",
  return_declined: "Return declined",
};

/** What happened to the order, oldest first; states shown as their words with the order badge. */
export function OrderTimeline({ input, currency }: { input: TimelineInput; currency: string }) {
  const events = orderTimeline(input);
  return (
    <ol className="space-y-3 border-l-2 border-graphite-200 pl-4" data-testid="order-timeline">
      {events.map((e, i) => (
        <li key={`${e.kind}-${i}`} className="relative">
          <span aria-hidden="true" className="absolute -left-[1.4rem] top-1.5 h-2.5 w-2.5 rounded-full border-2 border-paper bg-copper-600" />
          <div className="flex flex-wrap items-center gap-2">
            {e.state ? <ProductStateBadge kind="order" state={e.state} /> : null}
            <span className="font-medium">{WORDS[e.kind]}</span>
            {e.amountMinor !== undefined ? <span className="figure font-mono">{formatMoney(e.amountMinor, currency.toUpperCase())}</span> : null}
          </div>
          <p className="text-sm text-graphite-600">
            <time dateTime={e.at.toISOString()}>{formatOrderDateTime(e.at)}</time>
          </p>
          {e.detail ? <p className="font-mono text-sm break-all">{e.detail}</p> : null}
        </li>
      ))}
    </ol>
  );
}
