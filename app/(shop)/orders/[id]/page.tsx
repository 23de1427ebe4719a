import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { MainsCaution } from "@/components/caution";
import { Markdown } from "@/components/markdown";
import { AcknowledgementsList } from "@/components/orders/acknowledgements-list";
import { ActionButtonForm } from "@/components/orders/action-button-form";
import { formatOrderDate, formatOrderDateTime } from "@/components/orders/format";
import { OrderLinesTable } from "@/components/orders/order-lines-table";
import { OrderTimeline } from "@/components/orders/order-timeline";
import { ReasonForm } from "@/components/orders/reason-form";
import { RefundsTable } from "@/components/orders/refunds-table";
import { ReturnsList } from "@/components/orders/returns-list";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { getOrderDetail } from "@/db/queries/orders";
import { checkAccess } from "@/lib/auth/guard";
import { confirmDeliveryAction, requestReturnAction } from "../actions";

export const metadata: Metadata = { title: "Order" };

/** The window closes at the start of a day; the day before it is the last one a person can use. */
const lastDayOf = (closesAt: Date) => new Date(closesAt.getTime() - 1);
export const dynamic = "force-dynamic";

export default async function OrderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next={`/orders/${id}`} />;
  const detail = await getOrderDetail(id, access.user.id, "buyer");
  if (!detail) notFound();
  const { order } = detail;
  const openReturn = detail.returns.some((r) => r.status === "requested" || r.status === "accepted");
  const mayAskReturn = (order.state === "shipped" || order.state === "delivered") && detail.returnsWindowOpen && !openReturn;

  return (
    <article className="space-y-8" data-testid="order-page" data-state={order.state}>
      <PageHeader
        eyebrow={<Link href="/orders">Your orders</Link>}
        title={<span className="font-mono">{order.number}</span>}
        lede={`From ${detail.sellerName} · placed ${formatOrderDateTime(order.createdAt)}`}
        actions={<ProductStateBadge kind="order" state={order.state} className="text-sm" />}
      />

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <div className="space-y-8">
          <Panel title="Lines">
            <OrderLinesTable detail={detail} />
          </Panel>
          {detail.refunds.length > 0 ? (
            <Panel title="Refunds">
              <RefundsTable detail={detail} />
            </Panel>
          ) : null}
          {detail.acknowledgements.length > 0 ? (
            <Panel title="Safety sheets you acknowledged">
              <AcknowledgementsList acknowledgements={detail.acknowledgements} />
              <MainsCaution variant="short" className="mt-4" />
            </Panel>
          ) : null}
        </div>

        <div className="space-y-8">
          {order.trackingRef ? (
            <Panel title="Tracking">
              <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1" data-testid="order-tracking">
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
            <Panel title="Has it arrived?">
              <ActionButtonForm action={confirmDeliveryAction.bind(null, order.id)} label="Confirm delivery" pendingLabel="Confirming…" testId="confirm-delivery" />
            </Panel>
          ) : null}
          <Panel title="Returns">
            <div className="space-y-4">
              {detail.returns.length > 0 ? <ReturnsList returns={detail.returns} /> : null}
              {mayAskReturn ? (
                <>
                  <p className="text-sm text-graphite-700" data-testid="returns-window">
                    {detail.sellerName} takes returns for {detail.returnsWindowDays} days, counted from the day after delivery (from shipping until
                    you confirm delivery); you can ask until the end of {formatOrderDate(lastDayOf(detail.returnsWindowClosesAt!))} (UTC).
                  </p>
                  <ReasonForm
                    action={requestReturnAction.bind(null, order.id)}
                    label="Why do you want to return it?"
                    hint="The seller reads this and accepts (refund) or declines with a reason."
                    submitLabel="Request a return"
                    pendingLabel="Sending…"
                    testId="return-form"
                  />
                </>
              ) : !openReturn ? (
                <p className="text-sm text-graphite-600">
                  {order.state === "paid"
                    ? "A return can be asked for once the order has shipped."
                    : detail.returnsWindowClosesAt && (order.state === "shipped" || order.state === "delivered")
                      ? `The returns window closed at the end of ${formatOrderDate(lastDayOf(detail.returnsWindowClosesAt))} (UTC).`
                      : "This order cannot be returned."}
                </p>
              ) : null}
              {detail.returnsPolicyMd ? (
                <details className="text-sm">
                  <summary className="cursor-pointer font-medium">The seller&apos;s returns policy</summary>
                  <div className="mt-2">
                    <Markdown minHeadingLevel={4}>{detail.returnsPolicyMd}</Markdown>
                  </div>
                </details>
              ) : null}
            </div>
          </Panel>
        </div>
      </div>
    </article>
  );
}
