import Link from "next/link";
import type { ReactNode } from "react";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { lineProblemText, type CartLine, type SellerGroup } from "@/lib/checkout/cart-summary";
import { formatMoney } from "@/lib/format/money";

/** The cart's lines, one panel per seller with its subtotal; `controls` renders a line's quantity column. */
export function CartGroups({ groups, controls }: { groups: SellerGroup[]; controls?: (line: CartLine) => ReactNode }) {
  return (
    <div className="space-y-6">
      {groups.map((group) => (
        <Panel key={`${group.sellerId}-${group.currency}`} title={`Sold by ${group.shopName}`} actions={<span className="text-sm text-graphite-600">ships separately</span>}>
          <div data-testid="cart-seller" data-seller={group.sellerId}>
            <Table caption={`Items from ${group.shopName}`} captionHidden>
              <THead>
                <TRow>
                  <TH>Item</TH>
                  <TH numeric>Each</TH>
                  <TH>{controls ? "Quantity" : "Qty"}</TH>
                  <TH numeric>Amount</TH>
                </TRow>
              </THead>
              <TBody>
                {group.lines.map((line) => {
                  const problem = lineProblemText(line);
                  return (
                    <TRow key={line.listingId} data-testid="cart-line" data-listing={line.listingId}>
                      <TD>
                        <Link href={`/listings/${line.slug}`}>{line.title}</Link>
                        {line.mainsConnected ? <StateBadge label="mains-connected" tone="caution" className="ml-2" /> : null}
                        {problem ? <p className="mt-1 text-sm font-medium text-signal-700">{problem}</p> : null}
                      </TD>
                      <TD numeric>{formatMoney(line.priceMinor, line.currency)}</TD>
                      <TD>{controls ? controls(line) : <span className="figure font-mono">{line.quantity}</span>}</TD>
                      <TD numeric>{formatMoney(line.priceMinor * line.quantity, line.currency)}</TD>
                    </TRow>
                  );
                })}
                <TRow>
                  <TD colSpan={3} className="text-right font-semibold">
                    Subtotal from {group.shopName}
                  </TD>
                  <TD numeric className="font-semibold" data-testid="seller-subtotal">
                    {formatMoney(group.subtotalMinor, group.currency)}
                  </TD>
                </TRow>
              </TBody>
            </Table>
          </div>
        </Panel>
      ))}
    </div>
  );
}

export function CartTotals({ totals }: { totals: { currency: string; totalMinor: number }[] }) {
  return (
    <dl className="space-y-1" data-testid="cart-totals">
      {totals.map((t) => (
        <div key={t.currency} className="flex items-baseline justify-between gap-6 text-lg">
          <dt className="font-semibold">Total{totals.length > 1 ? ` in ${t.currency}` : ""}</dt>
          <dd className="figure font-mono font-semibold" data-testid="cart-total">
            {formatMoney(t.totalMinor, t.currency)}
          </dd>
        </div>
      ))}
    </dl>
  );
}
