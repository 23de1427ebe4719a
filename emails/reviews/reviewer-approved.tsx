import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading } from "./review-mail-parts";

export type ReviewerApprovedProps = { applicantName: string; deskUrl: string };

export const reviewerApprovedMail = defineMailTemplate<ReviewerApprovedProps>("reviewer-approved", {
  subject: () => "You are a Fluxyard reviewer",
  render: (p) => (
    <EmailFrame preview="Your reviewer application was approved">
      <Heading>Welcome aboard as a reviewer</Heading>
      <Text>Hello {p.applicantName},</Text>
      <Text>
        A moderator approved your application. Connect a payout account on your review desk: builders can book you once it is
        enabled, and your share of each review is paid there when you deliver the report.
      </Text>
      <ActionButton href={p.deskUrl}>Open your review desk</ActionButton>
    </EmailFrame>
  ),
});
