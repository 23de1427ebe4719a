import { defineMailTemplate } from "../registry";
import { ListingDecisionEmail, type ListingDecisionProps } from "./listing-decision-email";

export const listingApprovedMail = defineMailTemplate<ListingDecisionProps>("listing-approved", {
  subject: (p) => `Approved: “${p.listingTitle}” is live`,
  render: (p) => (
    <ListingDecisionEmail
      preview="Your listing is live"
      heading="Your listing is live"
      lines={[`A moderator checked the safety sheet of “${p.listingTitle}” and approved it. It is now in the catalog.`]}
      props={p}
    />
  ),
});
