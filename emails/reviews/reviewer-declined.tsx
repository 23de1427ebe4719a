import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading, Quoted } from "./review-mail-parts";

export type ReviewerDeclinedProps = { applicantName: string; reason: string; applyUrl: string };

export const reviewerDeclinedMail = defineMailTemplate<ReviewerDeclinedProps>("reviewer-declined", {
  subject: () => "Your application to review bring-ups",
  render: (p) => (
    <EmailFrame preview="Your reviewer application was not approved">
      <Heading>Your application was not approved</Heading>
      <Text>Hello {p.applicantName},</Text>
      <Text>A moderator read your application and did not approve it this time. Their reason:</Text>
      <Quoted>{p.reason}</Quoted>
      <Text>You can apply again once the points above are settled.</Text>
      <ActionButton href={p.applyUrl}>See your application</ActionButton>
    </EmailFrame>
  ),
});
