import { Text } from "@react-email/components";
import { formatMoney } from "@/lib/format/money";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { PaidButton, PaidLines, type PaidLine } from "./order-paid-email";

export type OrderPaidBuyerProps = {
  buyerName: string;
  currency: string;
  totalMinor: number;
  orders: { number: string; shopName: string; subtotalMinor: number; lines: PaidLine[] }[];
  ordersUrl: string;
};

export const orderPaidBuyerMail = defineMailTemplate<OrderPaidBuyerProps>("order-paid-buyer", {
  subject: (p) => (p.orders.length === 1 ? `Paid: order ${p.orders[0]?.number}` : `Paid: ${p.orders.length} orders from one checkout`),
  render: (p) => (
    <EmailFrame preview={`We received your payment of ${formatMoney(p.totalMinor, p.currency)}`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Payment received</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        We received your payment of {formatMoney(p.totalMinor, p.currency)}.{" "}
        {p.orders.length === 1 ? "The seller has been told and will ship it." : "Each seller ships their own order and has been told."}
      </Text>
      {p.orders.map((order) => (
        <div key={order.number}>
          <Text style={{ fontWeight: 700, marginBottom: 0 }}>
            Order {order.number} from {order.shopName} — {formatMoney(order.subtotalMinor, p.currency)}
          </Text>
          <PaidLines lines={order.lines} currency={p.currency} />
        </div>
      ))}
      <Text>
        Before the first power-up, read each item&apos;s safety sheet again. Bring mains up through a series lamp or an isolation
        transformer, and never work on the bus until you have measured it below 60 V.
      </Text>
      <PaidButton href={p.ordersUrl}>See your orders</PaidButton>
    </EmailFrame>
  ),
});
