import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type ReturnAcceptedProps = { buyerName: string; orderNumber: string; sellerName: string; refundAmount: string; orderUrl: string };

export const returnAcceptedMail = defineMailTemplate<ReturnAcceptedProps>("return-accepted", {
  subject: (p) => `Return accepted for order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`${p.sellerName} accepted your return`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your return is accepted</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        {p.sellerName} accepted the return of order {p.orderNumber}. {p.refundAmount} goes back to the card you paid with; you get a
        confirmation once the payment service has sent it.
      </Text>
      <Text>Pack mains parts so nothing can short in transit, and discharge any capacitors before you pack them.</Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the order
      </Button>
    </EmailFrame>
  ),
});
