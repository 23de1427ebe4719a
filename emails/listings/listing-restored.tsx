import { defineMailTemplate } from "../registry";
import { ListingDecisionEmail, type ListingDecisionProps } from "./listing-decision-email";

export const listingRestoredMail = defineMailTemplate<ListingDecisionProps>("listing-restored", {
  subject: (p) => `Restored: “${p.listingTitle}” is live again`,
  render: (p) => (
    <ListingDecisionEmail
      preview="Your listing is live again"
      heading="Your listing is live again"
      lines={[`A moderator restored “${p.listingTitle}”; it is back in the catalog.`]}
      props={p}
    />
  ),
});
