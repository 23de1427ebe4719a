import { defineMailTemplate } from "../registry";
import { ListingDecisionEmail, type ListingDecisionProps } from "./listing-decision-email";

export const listingHeldMail = defineMailTemplate<ListingDecisionProps>("listing-held", {
  subject: (p) => `Held: “${p.listingTitle}” is out of the catalog`,
  render: (p) => (
    <ListingDecisionEmail
      preview="Your listing is held"
      heading="Your listing is held"
      lines={[`“${p.listingTitle}” has been taken out of the catalog by a moderator. Buyers see that it is held. The reason is below.`]}
      props={p}
    />
  ),
});
