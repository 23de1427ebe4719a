import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { AcknowledgementsList } from "@/components/orders/acknowledgements-list";
import { ActionButtonForm } from "@/components/orders/action-button-form";
import { formatOrderDateTime } from "@/components/orders/format";
import { LineRefundForm } from "@/components/orders/line-refund-form";
import { OrderLinesTable } from "@/components/orders/order-lines-table";
import { OrderTimeline } from "@/components/orders/order-timeline";
import { ReasonForm } from "@/components/orders/reason-form";
import { RefundsTable } from "@/components/orders/refunds-table";
import { ReturnsList } from "@/components/orders/returns-list";
import { ShipForm } from "@/components/orders/ship-form";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { getOrderDetail } from "@/db/queries/orders";
import { checkAccess } from "@/lib/auth/guard";
import { formatMoney } from "@/lib/format/money";
import { basisPointsToPercent } from "@/lib/orders/amount-input";
import { acceptReturnAction, cancelOrderAction, declineReturnAction, markDeliveredAction, refundLineAction, shipOrderAction } from "../actions";

export const metadata: Metadata = { title: "Order" };
export const dynamic = "force-dynamic";

export default async function SellerOrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next={`/sell/orders/${id}`} />;
  const detail = await getOrderDetail(id, access.user.id, "seller");
  if (!detail) notFound();
  const { order } = detail;
  const currency = order.currency.toUpperCase();
  const refundable = detail.lines.filter((l) => l.refundableMinor > 0);
  const canRefund = refundable.length > 0 && ["paid", "shipped", "delivered", "cancelled"].includes(order.state);
  const openReturns = detail.returns.filter((r) => r.status === "requested");
  // The rate the checkout recorded, not today's setting.
  const feeRate = basisPointsToPercent(detail.feeBps);

  return (
    <article className="space-y-8" data-testid="seller-order-page" data-state={order.state}>
      <PageHeader
        eyebrow={<Link href="/sell/orders">Incoming orders</Link>}
        title={<span className="font-mono">{order.number}</span>}
        lede={`For ${detail.buyerName} · paid ${order.paidAt ? formatOrderDateTime(order.paidAt) : "—"}`}
        actions={<ProductStateBadge kind="order" state={order.state} className="text-sm" />}
      />

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <div className="space-y-8">
          <Panel title="Lines">
            <OrderLinesTable detail={detail} />
            <dl className="mt-4 grid max-w-sm grid-cols-[1fr_auto] gap-x-6 gap-y-1 text-sm">
              <dt>Platform fee ({feeRate} %)</dt>
              <dd className="figure text-right font-mono">−{formatMoney(order.feeMinor, currency)}</dd>
              <dt className="font-semibold">Your share</dt>
              <dd className="figure text-right font-mono font-semibold">{formatMoney(order.sellerShareMinor, currency)}</dd>
            </dl>
            <p className="mt-2 text-xs text-graphite-600">A refund gives back the fee in proportion (rounded half up to the cent); the rest comes off your share.</p>
          </Panel>

          {openReturns.length > 0 ? (
            <Panel title="Return requests">
              <div className="space-y-6">
                {openReturns.map((r) => (
                  <div key={r.id} className="space-y-3" data-testid="return-decision">
                    <ReturnsList returns={[r]} viewer="seller" />
                    <ActionButtonForm action={acceptReturnAction.bind(null, order.id, r.id, currency)} label="Accept and refund the rest" pendingLabel="Refunding…" />
                    <ReasonForm action={declineReturnAction.bind(null, order.id, r.id)} label="Or decline, saying why" submitLabel="Decline the return" pendingLabel="Declining…" variant="secondary" />
                  </div>
                ))}
              </div>
            </Panel>
          ) : null}

          {order.state === "paid" ? (
            <Panel title="Ship it">
              <ShipForm action={shipOrderAction.bind(null, order.id)} />
            </Panel>
          ) : null}

          {canRefund ? (
            <Panel title="Refund part of a line">
              <LineRefundForm action={refundLineAction.bind(null, order.id)} lines={refundable} currency={currency} />
            </Panel>
          ) : null}

          {detail.refunds.length > 0 ? (
            <Panel title="Refunds">
              <RefundsTable detail={detail} />
            </Panel>
          ) : null}
        </div>

        <div className="space-y-8">
          {order.trackingRef ? (
            <Panel title="Tracking">
              <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
                <dt className="text-graphite-600">Carrier</dt>
                <dd>{order.carrier}</dd>
                <dt className="text-graphite-600">Reference</dt>
                <dd className="font-mono">{order.trackingRef}</dd>
              </dl>
            </Panel>
          ) : null}
          <Panel title="Status">
            <OrderTimeline input={{ ...order, refunds: detail.refunds, returns: detail.returns }} currency={order.currency} />
          </Panel>
          {order.state === "shipped" ? (
            <Panel title="Delivered?">
              <ActionButtonForm action={markDeliveredAction.bind(null, order.id)} label="Mark delivered" pendingLabel="Saving…" variant="secondary" />
            </Panel>
          ) : null}
          {order.state === "paid" ? (
            <Panel title="Cancel before shipping">
              <p className="mb-3 text-sm text-graphite-700">
                Cancelling refunds the buyer in full ({formatMoney(order.subtotalMinor - order.refundedMinor, currency)}) and puts every line&apos;s quantity back in stock.
              </p>
              <ActionButtonForm action={cancelOrderAction.bind(null, order.id, currency)} label="Cancel the order" pendingLabel="Cancelling…" variant="danger" confirm="I will not ship this order" testId="cancel-order" />
            </Panel>
          ) : null}
          {detail.returns.length > openReturns.length ? (
            <Panel title="Earlier returns">
              <ReturnsList returns={detail.returns.filter((r) => r.status !== "requested")} viewer="seller" />
            </Panel>
          ) : null}
          {detail.acknowledgements.length > 0 ? (
            <Panel title="Buyer's acknowledgements">
              <AcknowledgementsList acknowledgements={detail.acknowledgements} />
            </Panel>
          ) : null}
        </div>
      </div>
    </article>
  );
}
