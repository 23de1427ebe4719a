import { StateBadge, type StateTone } from "@/components/ui/state-badge";
import type { OrderDetail } from "@/db/queries/orders";
import { formatOrderDateTime } from "./format";

const STATUS: Record<OrderDetail["returns"][number]["status"], { label: string; tone: StateTone }> = {
  requested: { label: "Waiting for the seller", tone: "caution" },
  accepted: { label: "Accepted", tone: "clear" },
  declined: { label: "Declined", tone: "neutral" },
};

export function ReturnsList({ returns, viewer = "buyer" }: { returns: OrderDetail["returns"]; viewer?: OrderDetail["party"] }) {
  return (
    <ul className="space-y-3" data-testid="order-returns">
      {returns.map((r) => (
        <li key={r.id} className="rounded border border-graphite-200 px-3 py-2">
          <div className="flex flex-wrap items-center gap-2">
            <StateBadge label={r.status === "requested" && viewer === "seller" ? "Waiting for your answer" : STATUS[r.status].label} tone={STATUS[r.status].tone} />
            <span className="text-sm text-graphite-600">asked {formatOrderDateTime(r.createdAt)}</span>
          </div>
          <p className="mt-1 text-sm">{r.reason}</p>
          {r.decisionReason ? <p className="mt-1 border-l-2 border-graphite-300 pl-2 text-sm text-graphite-700">Seller: {r.decisionReason}</p> : null}
        </li>
      ))}
    </ul>
  );
}
