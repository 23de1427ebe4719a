import Link from "next/link";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { formatMoney } from "@/lib/format/money";
import type { BuyerOrderRow } from "@/db/queries/orders";
import { formatOrderDate } from "./format";

export function BuyerOrdersTable({ rows }: { rows: BuyerOrderRow[] }) {
  return (
    <Table caption="Your orders" captionHidden data-testid="buyer-orders">
      <THead>
        <TRow>
          <TH>Order</TH>
          <TH>Date</TH>
          <TH>Seller</TH>
          <TH>State</TH>
          <TH numeric>Total</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((o) => (
          <TRow key={o.id} data-testid={`order-row-${o.number}`}>
            <TD>
              <Link href={`/orders/${o.id}`} className="font-mono">
                {o.number}
              </Link>
            </TD>
            <TD className="whitespace-nowrap">{formatOrderDate(o.createdAt)}</TD>
            <TD>{o.sellerName}</TD>
            <TD>
              <ProductStateBadge kind="order" state={o.state} />
            </TD>
            <TD numeric>
              {formatMoney(o.subtotalMinor, o.currency.toUpperCase())}
              {o.refundedMinor > 0 && o.refundedMinor < o.subtotalMinor ? (
                <span className="block text-xs text-graphite-600">{formatMoney(o.refundedMinor, o.currency.toUpperCase())} refunded</span>
              ) : null}
            </TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
