import { Text } from "@react-email/components";
import { formatMoney } from "@/lib/format/money";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { PaidButton, PaidLines, type PaidLine } from "./order-paid-email";

export type OrderPaidSellerProps = {
  sellerName: string;
  orderNumber: string;
  currency: string;
  subtotalMinor: number;
  feeMinor: number;
  sellerShareMinor: number;
  feeRate: string;
  lines: PaidLine[];
  ordersUrl: string;
};

export const orderPaidSellerMail = defineMailTemplate<OrderPaidSellerProps>("order-paid-seller", {
  subject: (p) => `New paid order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`Order ${p.orderNumber} is paid: ${formatMoney(p.subtotalMinor, p.currency)}`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>A paid order to ship</Text>
      <Text>Hello {p.sellerName},</Text>
      <Text>Order {p.orderNumber} is paid. Please pack and ship it, then add the carrier and tracking reference.</Text>
      <PaidLines lines={p.lines} currency={p.currency} />
      <Text>
        Subtotal {formatMoney(p.subtotalMinor, p.currency)} · platform fee ({p.feeRate}) {formatMoney(p.feeMinor, p.currency)} · your share{" "}
        {formatMoney(p.sellerShareMinor, p.currency)}, sent to your payout account.
      </Text>
      <PaidButton href={p.ordersUrl}>Open your orders</PaidButton>
    </EmailFrame>
  ),
});
