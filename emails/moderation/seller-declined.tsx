import { Button, Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame, emailColours } from "../email-frame";

export type SellerDeclinedProps = { applicantName: string; shopName: string; reason: string; applicationUrl: string };

export const sellerDeclinedMail = defineMailTemplate<SellerDeclinedProps>("seller-declined", {
  subject: (p) => `Your seller application for “${p.shopName}”`,
  render: (p) => (
    <EmailFrame preview="Your seller application was not approved">
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your application was not approved</Text>
      <Text>Hello {p.applicantName},</Text>
      <Text>A moderator read your application for “{p.shopName}” and did not approve it this time. Their reason:</Text>
      <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{p.reason}</Text>
      <Text>You can apply again once the points above are settled.</Text>
      <Button href={p.applicationUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        See your application
      </Button>
    </EmailFrame>
  ),
});
