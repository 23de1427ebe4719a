import { defineMailTemplate } from "../registry";
import { ListingDecisionEmail, type ListingDecisionProps } from "./listing-decision-email";

export const listingSentBackMail = defineMailTemplate<ListingDecisionProps>("listing-sent-back", {
  subject: (p) => `Changes needed: “${p.listingTitle}”`,
  render: (p) => (
    <ListingDecisionEmail
      preview="A moderator sent your listing back"
      heading="Your listing was sent back"
      lines={[`A moderator reviewed “${p.listingTitle}” and asks for changes before it can go live. Fix the points below and submit it again.`]}
      props={p}
    />
  ),
});
