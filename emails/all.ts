// Imports every outbox template so each registers itself (see registry.tsx).
export { listingApprovedMail } from "./listings/listing-approved";
export { listingSentBackMail } from "./listings/listing-sent-back";
export { listingHeldMail } from "./listings/listing-held";
export { listingRestoredMail } from "./listings/listing-restored";
export { sellerApplicationReceivedMail } from "./sellers/seller-application-received";
export { sellerApprovedMail } from "./moderation/seller-approved";
export { sellerDeclinedMail } from "./moderation/seller-declined";
export { policyGraceNoticeMail } from "./moderation/policy-grace-notice";
export { orderShippedMail } from "./orders/order-shipped";
export { orderRefundedMail } from "./orders/order-refunded";
export { orderCancelledMail } from "./orders/order-cancelled";
export { returnRequestedMail } from "./orders/return-requested";
export { returnAcceptedMail } from "./orders/return-accepted";
export { returnDeclinedMail } from "./orders/return-declined";
export { orderPaidBuyerMail } from "./orders/order-paid-buyer";
export { orderPaidSellerMail } from "./orders/order-paid-seller";
export { orderPaidRefundedMail } from "./orders/order-paid-refunded";
