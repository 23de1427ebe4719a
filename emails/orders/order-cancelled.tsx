import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type OrderCancelledProps = { buyerName: string; orderNumber: string; sellerName: string; refundAmount: string; orderUrl: string };

export const orderCancelledMail = defineMailTemplate<OrderCancelledProps>("order-cancelled", {
  subject: (p) => `Cancelled: order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`Order ${p.orderNumber} was cancelled before shipping`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your order was cancelled</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        {p.sellerName} cancelled order {p.orderNumber} before shipping it. {p.refundAmount} goes back to the card you paid with; a
        second e-mail confirms each refund once the payment service has sent it.
      </Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the order
      </Button>
    </EmailFrame>
  ),
});
