import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading } from "./review-mail-parts";

export type ReviewerApplicationReceivedProps = { applicantName: string; statusUrl: string };

export const reviewerApplicationReceivedMail = defineMailTemplate<ReviewerApplicationReceivedProps>("reviewer-application-received", {
  subject: () => "We have your application to review bring-ups",
  render: (p) => (
    <EmailFrame preview="Your reviewer application is with a moderator">
      <Heading>Application received</Heading>
      <Text>Hello {p.applicantName},</Text>
      <Text>
        Thank you for offering to review other builders&apos; bring-ups. A moderator reads your profile and track record; you will hear
        from us by e-mail once it is decided.
      </Text>
      <ActionButton href={p.statusUrl}>See your application</ActionButton>
    </EmailFrame>
  ),
});
