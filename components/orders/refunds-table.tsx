import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { formatMoney } from "@/lib/format/money";
import type { OrderDetail } from "@/db/queries/orders";
import { formatOrderDateTime } from "./format";

export function RefundsTable({ detail }: { detail: OrderDetail }) {
  const currency = detail.order.currency.toUpperCase();
  const titleOf = (lineId: string | null) => detail.lines.find((l) => l.id === lineId)?.title ?? "Whole order";
  return (
    <Table caption="Refunds" captionHidden data-testid="order-refunds">
      <THead>
        <TRow>
          <TH>Date</TH>
          <TH>Item</TH>
          <TH>Reason</TH>
          <TH>Status</TH>
          <TH numeric>Amount</TH>
        </TRow>
      </THead>
      <TBody>
        {detail.refunds.map((r) => (
          <TRow key={r.id}>
            <TD className="whitespace-nowrap">{formatOrderDateTime(r.createdAt)}</TD>
            <TD>{titleOf(r.orderLineId)}</TD>
            <TD>{r.reason}</TD>
            <TD>{r.settled ? <StateBadge label="Refunded" tone="clear" /> : <StateBadge label="Waiting for the payment service" tone="caution" />}</TD>
            <TD numeric>{formatMoney(r.amountMinor, currency)}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
