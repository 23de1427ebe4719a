// Imports every outbox template so each registers itself (see registry.tsx).
export { listingApprovedMail } from "./listings/listing-approved";
export { listingSentBackMail } from "./listings/listing-sent-back";
export { listingHeldMail } from "./listings/listing-held";
export { listingRestoredMail } from "./listings/listing-restored";
export { sellerApplicationReceivedMail } from "./sellers/seller-application-received";
export { sellerApplicationApprovedMail } from "./sellers/seller-application-approved";
export { sellerApplicationDeclinedMail } from "./sellers/seller-application-declined";
