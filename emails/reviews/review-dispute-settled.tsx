import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading, Quoted } from "./review-mail-parts";

export type ReviewDisputeSettledProps = {
  name: string;
  role: "builder" | "reviewer";
  logTitle: string;
  outcome: string;
  refund: string | null;
  note: string;
  sessionUrl: string;
};

export const reviewDisputeSettledMail = defineMailTemplate<ReviewDisputeSettledProps>("review-dispute-settled", {
  subject: (p) => `The dispute about “${p.logTitle}” is settled`,
  render: (p) => (
    <EmailFrame preview="A moderator settled the dispute">
      <Heading>The dispute is settled</Heading>
      <Text>Hello {p.name},</Text>
      <Text>
        A moderator decided the dispute about the review of “{p.logTitle}”: {p.outcome}.
        {p.refund ? (p.role === "builder" ? ` ${p.refund} goes back to your card.` : ` ${p.refund} goes back to the builder.`) : ""}
      </Text>
      <Quoted>{p.note}</Quoted>
      <ActionButton href={p.sessionUrl}>See the session</ActionButton>
    </EmailFrame>
  ),
});
