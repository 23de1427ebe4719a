import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading, Quoted } from "./review-mail-parts";

export type ReviewDisputedProps = { reviewerName: string; builderName: string; logTitle: string; reason: string; sessionUrl: string };

export const reviewDisputedMail = defineMailTemplate<ReviewDisputedProps>("review-disputed", {
  subject: (p) => `${p.builderName} disputed your review of “${p.logTitle}”`,
  render: (p) => (
    <EmailFrame preview="A builder disputed your report">
      <Heading>Your report is disputed</Heading>
      <Text>Hello {p.reviewerName},</Text>
      <Text>{p.builderName} disputed your report on “{p.logTitle}”. Their reason:</Text>
      <Quoted>{p.reason}</Quoted>
      <Text>A moderator decides whether the payment stands or is refunded in part or in full, and writes to you both.</Text>
      <ActionButton href={p.sessionUrl}>See the session</ActionButton>
    </EmailFrame>
  ),
});
