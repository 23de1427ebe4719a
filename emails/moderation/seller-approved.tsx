import { Button, Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame, emailColours } from "../email-frame";

export type SellerApprovedProps = { applicantName: string; shopName: string; sellerDeskUrl: string };

export const sellerApprovedMail = defineMailTemplate<SellerApprovedProps>("seller-approved", {
  subject: (p) => `Your shop “${p.shopName}” is open on Fluxyard`,
  render: (p) => (
    <EmailFrame preview="Your seller application was approved">
      <Text style={{ fontSize: 18, fontWeight: 700 }}>Your shop is open</Text>
      <Text>Hello {p.applicantName},</Text>
      <Text>
        A moderator approved your application for “{p.shopName}”. You can now draft listings on your seller desk. Connect a payout
        account there first: listings can be submitted for review only once it is enabled.
      </Text>
      <Text>Every listing carries a mains safety sheet, which a moderator checks before it goes live.</Text>
      <Button href={p.sellerDeskUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open your seller desk
      </Button>
    </EmailFrame>
  ),
});
