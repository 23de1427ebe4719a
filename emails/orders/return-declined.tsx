import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type ReturnDeclinedProps = { buyerName: string; orderNumber: string; sellerName: string; reason: string; orderUrl: string };

export const returnDeclinedMail = defineMailTemplate<ReturnDeclinedProps>("return-declined", {
  subject: (p) => `Return declined for order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`${p.sellerName} declined your return`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your return was declined</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        {p.sellerName} declined the return of order {p.orderNumber}. Their reason:
      </Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{p.reason}</Text>
      <Text>The order page keeps the request and this decision with the rest of the order's history.</Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the order
      </Button>
    </EmailFrame>
  ),
});
