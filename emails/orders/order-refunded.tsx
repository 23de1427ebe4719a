import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type OrderRefundedProps = { buyerName: string; orderNumber: string; amount: string; lineTitle: string | null; reason: string; orderUrl: string };

export const orderRefundedMail = defineMailTemplate<OrderRefundedProps>("order-refunded", {
  subject: (p) => `Refund of ${p.amount} for order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`${p.amount} is on its way back to you`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Refund sent: {p.amount}</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        {p.amount} of order {p.orderNumber}
        {p.lineTitle ? ` (${p.lineTitle})` : ""} has been refunded to the card you paid with. Banks usually show it within a few
        working days.
      </Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{p.reason}</Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the order
      </Button>
    </EmailFrame>
  ),
});
