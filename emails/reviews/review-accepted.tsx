import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading } from "./review-mail-parts";

export type ReviewAcceptedProps = { builderName: string; reviewerName: string; logTitle: string; deliverBy: string; sessionUrl: string };

export const reviewAcceptedMail = defineMailTemplate<ReviewAcceptedProps>("review-accepted", {
  subject: (p) => `${p.reviewerName} accepted your review of “${p.logTitle}”`,
  render: (p) => (
    <EmailFrame preview="Your review request was accepted">
      <Heading>Your review is under way</Heading>
      <Text>Hello {p.builderName},</Text>
      <Text>
        {p.reviewerName} accepted your request and can now read the log “{p.logTitle}”, its readings and photos. The report is due by{" "}
        {p.deliverBy}; your payment is captured only when it arrives.
      </Text>
      <Text>Until then, keep the build de-energised and its bus discharged.</Text>
      <ActionButton href={p.sessionUrl}>See the review session</ActionButton>
    </EmailFrame>
  ),
});
