import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type ReturnRequestedProps = { sellerName: string; buyerName: string; orderNumber: string; reason: string; orderUrl: string };

export const returnRequestedMail = defineMailTemplate<ReturnRequestedProps>("return-requested", {
  subject: (p) => `Return requested for order ${p.orderNumber}`,
  render: (p) => (
    <EmailFrame preview={`${p.buyerName} asks to return order ${p.orderNumber}`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>A buyer asks for a return</Text>
      <Text>Hello {p.sellerName},</Text>
      <Text>
        {p.buyerName} asks to return order {p.orderNumber}. Their reason:
      </Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{p.reason}</Text>
      <Text>Accept it to refund what is left of the order, or decline it with a reason the buyer will read.</Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Decide on the return
      </Button>
    </EmailFrame>
  ),
});
