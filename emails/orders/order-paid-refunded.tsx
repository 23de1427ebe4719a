import { Text } from "@react-email/components";
import { formatMoney } from "@/lib/format/money";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { PaidButton } from "./order-paid-email";

export type OrderPaidRefundedProps = {
  buyerName: string;
  currency: string;
  totalMinor: number;
  titles: string[];
  cartUrl: string;
};

/** The rare case: the payment arrived after the hold on the stock had run out and the stock was gone. */
export const orderPaidRefundedMail = defineMailTemplate<OrderPaidRefundedProps>("order-paid-refunded", {
  subject: () => "Your payment is being refunded: the items sold out",
  render: (p) => (
    <EmailFrame preview={`We are refunding ${formatMoney(p.totalMinor, p.currency)} in full`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your payment is being refunded</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        Your payment of {formatMoney(p.totalMinor, p.currency)} reached us after the time to pay had run out, and by then the stock we had
        held for you was sold: {p.titles.join(", ")}. We are refunding the full amount to your card; no order was placed.
      </Text>
      <PaidButton href={p.cartUrl}>Back to your cart</PaidButton>
    </EmailFrame>
  ),
});
