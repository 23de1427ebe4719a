import { defineMailTemplate } from "../registry";
import { SellerApplicationEmail, type SellerApplicationMailProps } from "./seller-application-email";

export const sellerApplicationReceivedMail = defineMailTemplate<SellerApplicationMailProps>("seller-application-received", {
  subject: (p) => `We have your application for “${p.shopName}”`,
  render: (p) => (
    <SellerApplicationEmail
      preview="Your seller application is waiting for a moderator"
      heading="Application received"
      lines={[
        `Thank you for applying to sell on Fluxyard as “${p.shopName}”. A moderator reads every application; you will get an e-mail when it is decided.`,
        "Until then you can keep browsing and building; nothing else is needed from you.",
      ]}
      props={p}
    />
  ),
});
