import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { formatMoney } from "@/lib/format/money";
import type { OrderDetail } from "@/db/queries/orders";

/** The order's lines with what was refunded of each; the seller also sees what can still be refunded. */
export function OrderLinesTable({ detail }: { detail: OrderDetail }) {
  const currency = detail.order.currency.toUpperCase();
  const seller = detail.party === "seller";
  return (
    <Table caption="Lines" captionHidden data-testid="order-lines">
      <THead>
        <TRow>
          <TH>Item</TH>
          <TH numeric>Sheet rev.</TH>
          <TH numeric>Unit price</TH>
          <TH numeric>Qty</TH>
          <TH numeric>Total</TH>
          <TH numeric>Refunded</TH>
          {seller ? <TH numeric>Refundable</TH> : null}
        </TRow>
      </THead>
      <TBody>
        {detail.lines.map((l) => (
          <TRow key={l.id}>
            <TD>{l.title}</TD>
            <TD numeric>{l.sheetRevision}</TD>
            <TD numeric>{formatMoney(l.unitPriceMinor, currency)}</TD>
            <TD numeric>{l.quantity}</TD>
            <TD numeric>{formatMoney(l.totalMinor, currency)}</TD>
            <TD numeric>{l.refundedMinor > 0 ? formatMoney(l.refundedMinor, currency) : "—"}</TD>
            {seller ? <TD numeric>{formatMoney(l.refundableMinor, currency)}</TD> : null}
          </TRow>
        ))}
        <TRow>
          <TD className="font-semibold" colSpan={4}>
            Subtotal
          </TD>
          <TD numeric className="font-semibold">
            {formatMoney(detail.order.subtotalMinor, currency)}
          </TD>
          <TD numeric className="font-semibold" data-testid="order-refunded-total">
            {detail.order.refundedMinor > 0 ? formatMoney(detail.order.refundedMinor, currency) : "—"}
          </TD>
          {seller ? <TD /> : null}
        </TRow>
      </TBody>
    </Table>
  );
}
