import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading, Quoted } from "./review-mail-parts";

export type ReviewRequestedProps = {
  reviewerName: string;
  builderName: string;
  logTitle: string;
  stages: string;
  share: string;
  respondBy: string;
  message: string;
  sessionUrl: string;
};

export const reviewRequestedMail = defineMailTemplate<ReviewRequestedProps>("review-requested", {
  subject: (p) => `Review request: “${p.logTitle}”`,
  render: (p) => (
    <EmailFrame preview={`${p.builderName} asks you to review a bring-up`}>
      <Heading>A builder asks for your review</Heading>
      <Text>Hello {p.reviewerName},</Text>
      <Text>
        {p.builderName} booked a review of the bring-up log “{p.logTitle}” ({p.stages}). The payment is held; your share is {p.share},
        paid when you deliver the report.
      </Text>
      {p.message ? <Quoted>{p.message}</Quoted> : null}
      <Text>Accept or decline by {p.respondBy}. Without an answer the request expires and the builder&apos;s payment is released.</Text>
      <ActionButton href={p.sessionUrl}>Answer the request</ActionButton>
    </EmailFrame>
  ),
});
