import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading } from "./review-mail-parts";

export type ReviewDeliveredProps = {
  builderName: string;
  reviewerName: string;
  logTitle: string;
  amount: string;
  stops: number;
  attention: number;
  fine: number;
  disputeBy: string;
  sessionUrl: string;
};

export const reviewDeliveredMail = defineMailTemplate<ReviewDeliveredProps>("review-delivered", {
  subject: (p) => (p.stops > 0 ? `Your review report: do not power “${p.logTitle}” up again yet` : `Your review report for “${p.logTitle}” is ready`),
  render: (p) => (
    <EmailFrame preview="The reviewer delivered the report">
      <Heading>{p.stops > 0 ? "Report delivered — stop before the next power-up" : "Report delivered"}</Heading>
      <Text>Hello {p.builderName},</Text>
      <Text>
        {p.reviewerName} delivered the review of “{p.logTitle}”: {p.fine} fine, {p.attention} needing attention, {p.stops} stop.
        {p.stops > 0 ? " A stop verdict means: do not power the build up again until that point is fixed." : ""}
      </Text>
      <Text>
        Your payment of {p.amount} is now charged. If the report does not do what was booked, you can dispute it until {p.disputeBy}.
      </Text>
      <ActionButton href={p.sessionUrl}>Read the report</ActionButton>
    </EmailFrame>
  ),
});
