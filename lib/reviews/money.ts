import { splitFee } from "@/lib/checkout/fees";
import { splitRefund } from "@/lib/orders/refund-split";

// A review's money in integer minor units: the platform's fee and the reviewer's share of the price,
// and how a refund after a dispute divides between the two (the same pro-rata rule as order refunds).

export type ReviewSplit = { feeMinor: number; reviewerShareMinor: number };

export function reviewSplit(priceMinor: number, feeBps: number): ReviewSplit {
  const { feeMinor, sellerShareMinor } = splitFee(priceMinor, feeBps);
  return { feeMinor, reviewerShareMinor: sellerShareMinor };
}

export type RefundParts = { feeMinor: number; reviewerMinor: number };

/** The part of a refund the platform gives back from its fee, and the part taken back from the reviewer. */
export function refundParts(session: { priceMinor: number; feeMinor: number; refundedMinor: number }, amountMinor: number): RefundParts {
  const split = splitRefund({ subtotalMinor: session.priceMinor, feeMinor: session.feeMinor, refundedBeforeMinor: session.refundedMinor, amountMinor });
  return { feeMinor: split.feeMinor, reviewerMinor: split.sellerMinor };
}

/** What is still owed to the reviewer: their share less their part of whatever was refunded. */
export function reviewerShareDue(session: { priceMinor: number; feeMinor: number; reviewerShareMinor: number; refundedMinor: number }): number {
  if (session.refundedMinor === 0) return session.reviewerShareMinor;
  const back = refundParts({ ...session, refundedMinor: 0 }, session.refundedMinor).reviewerMinor;
  return session.reviewerShareMinor - back;
}
