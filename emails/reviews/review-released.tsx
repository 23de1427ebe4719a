import { Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame } from "../email-frame";
import { ActionButton, Heading, Quoted } from "./review-mail-parts";

export type ReviewReleasedProps = {
  builderName: string;
  reviewerName: string;
  logTitle: string;
  amount: string;
  why: "declined" | "expired";
  note: string;
  sessionUrl: string;
  reviewersUrl: string;
};

export const reviewReleasedMail = defineMailTemplate<ReviewReleasedProps>("review-released", {
  subject: (p) => (p.why === "declined" ? `${p.reviewerName} declined your review request` : `Your review request for “${p.logTitle}” expired`),
  render: (p) => (
    <EmailFrame preview="Your held payment is released">
      <Heading>{p.why === "declined" ? "Your request was declined" : "Your request expired"}</Heading>
      <Text>Hello {p.builderName},</Text>
      <Text>
        {p.why === "declined"
          ? `${p.reviewerName} declined the review of “${p.logTitle}”.`
          : `${p.reviewerName} did not get to the review of “${p.logTitle}” in time.`}{" "}
        The {p.amount} held on your card is released; nothing was charged.
      </Text>
      {p.note ? <Quoted>{p.note}</Quoted> : null}
      <Text>You can book another reviewer at any time.</Text>
      <ActionButton href={p.reviewersUrl}>Find another reviewer</ActionButton>
      <Text style={{ fontSize: 13 }}>
        The session: <a href={p.sessionUrl}>{p.sessionUrl}</a>
      </Text>
    </EmailFrame>
  ),
});
