import Link from "next/link";
import { StateBadge, ProductStateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow, type SortDirection } from "@/components/ui/table";
import { formatMoney } from "@/lib/format/money";
import type { SellerOrderRow } from "@/db/queries/orders";
import type { SellerOrderSort, SellerOrdersQuery } from "@/lib/validations/orders";
import { formatOrderDate } from "./format";

/** What the seller should do next with an order, in words; null when nothing is waiting on them. */
function nextStep(o: SellerOrderRow): { label: string; tone: "active" | "caution" } | null {
  if (o.openReturn) return { label: "Return requested", tone: "caution" };
  if (o.pendingRefunds > 0) return { label: "Refund waiting", tone: "caution" };
  if (o.state === "paid") return { label: "To ship", tone: "active" };
  return null;
}

export function SellerOrdersTable({ rows, query, hrefFor }: { rows: SellerOrderRow[]; query: SellerOrdersQuery; hrefFor: (change: Partial<SellerOrdersQuery>) => string }) {
  const sortable = (column: SellerOrderSort, label: string, numeric = false) => {
    const active = query.sort === column;
    const sort: SortDirection = active ? (query.dir === "asc" ? "ascending" : "descending") : "none";
    const nextDir = active && query.dir === "desc" ? "asc" : active ? "desc" : column === "number" ? "asc" : "desc";
    return (
      <TH numeric={numeric} sort={sort} sortHref={hrefFor({ sort: column, dir: nextDir, page: 1 })}>
        {label}
      </TH>
    );
  };
  return (
    <Table caption="Incoming orders" captionHidden data-testid="seller-orders">
      <THead>
        <TRow>
          {sortable("number", "Order")}
          {sortable("date", "Paid")}
          <TH>Buyer</TH>
          <TH numeric>Items</TH>
          {sortable("state", "State")}
          <TH>Needs</TH>
          {sortable("total", "Total", true)}
          <TH numeric>Your share</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((o) => {
          const step = nextStep(o);
          const currency = o.currency.toUpperCase();
          return (
            <TRow key={o.id} data-testid={`seller-order-row-${o.number}`}>
              <TD>
                <Link href={`/sell/orders/${o.id}`} className="font-mono">
                  {o.number}
                </Link>
              </TD>
              <TD className="whitespace-nowrap">{formatOrderDate(o.paidAt ?? o.createdAt)}</TD>
              <TD>{o.buyerName}</TD>
              <TD numeric>{o.itemCount}</TD>
              <TD>
                <ProductStateBadge kind="order" state={o.state} />
              </TD>
              <TD>{step ? <StateBadge label={step.label} tone={step.tone} /> : <span className="text-graphite-500">—</span>}</TD>
              <TD numeric>
                {formatMoney(o.subtotalMinor, currency)}
                {o.refundedMinor > 0 ? <span className="block text-xs text-graphite-600">−{formatMoney(o.refundedMinor, currency)} refunded</span> : null}
              </TD>
              <TD numeric>{formatMoney(o.sellerShareMinor, currency)}</TD>
            </TRow>
          );
        })}
      </TBody>
    </Table>
  );
}
