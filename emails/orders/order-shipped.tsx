import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";
import { defineMailTemplate } from "../registry";

export type OrderShippedProps = { buyerName: string; orderNumber: string; sellerName: string; carrier: string; trackingRef: string; orderUrl: string };

export const orderShippedMail = defineMailTemplate<OrderShippedProps>("order-shipped", {
  subject: (p) => `Shipped: order ${p.orderNumber} is on its way`,
  render: (p) => (
    <EmailFrame preview={`${p.carrier} ${p.trackingRef}`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your order is on its way</Text>
      <Text>Hello {p.buyerName},</Text>
      <Text>
        {p.sellerName} has shipped order {p.orderNumber}.
      </Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>
        Carrier: {p.carrier}
        <br />
        Tracking reference: <span style={{ fontFamily: "monospace" }}>{p.trackingRef}</span>
      </Text>
      <Text>When it arrives, confirm the delivery on the order page. Before the first power-up, read the safety sheet again.</Text>
      <Button href={p.orderUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the order
      </Button>
    </EmailFrame>
  ),
});
