// Imports every outbox template so each registers itself (see registry.tsx).
export { listingApprovedMail } from "./listings/listing-approved";
export { listingSentBackMail } from "./listings/listing-sent-back";
export { listingHeldMail } from "./listings/listing-held";
export { listingRestoredMail } from "./listings/listing-restored";
