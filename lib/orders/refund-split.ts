// How a refund splits between the platform's fee and the seller's share.
//
// The fee goes back pro rata to what is refunded, rounded half up to a whole minor unit; the rest of
// the refund comes out of the seller's share (a reversal of their transfer). The rounding is applied
// to the running total rather than to each refund, so however an order is refunded in parts, once
// all of it is refunded exactly the whole fee and the whole seller's share have gone back.

/** ⌊a·b / d + ½⌋ for integers a, b ≥ 0 and d > 0: round half up, exact (BigInt, so a·b may pass 2^53). */
export function mulDivRoundHalfUp(a: number, b: number, d: number): number {
  if (![a, b, d].every(Number.isSafeInteger) || a < 0 || b < 0 || d <= 0) {
    throw new RangeError(`mulDivRoundHalfUp needs integers a, b ≥ 0 and d > 0, got ${a}·${b} / ${d}`);
  }
  const denominator = BigInt(d);
  return Number((2n * BigInt(a) * BigInt(b) + denominator) / (2n * denominator));
}

export type RefundSplitInput = {
  subtotalMinor: number;
  feeMinor: number;
  /** refunded on this order before this refund (settled refunds only) */
  refundedBeforeMinor: number;
  amountMinor: number;
};

export type RefundSplit = { feeMinor: number; sellerMinor: number };

export function splitRefund({ subtotalMinor, feeMinor, refundedBeforeMinor, amountMinor }: RefundSplitInput): RefundSplit {
  for (const [name, value] of Object.entries({ subtotalMinor, feeMinor, refundedBeforeMinor, amountMinor })) {
    if (!Number.isSafeInteger(value) || value < 0) throw new RangeError(`${name} must be a non-negative integer of minor units, got ${value}`);
  }
  if (subtotalMinor === 0 || feeMinor > subtotalMinor) throw new RangeError(`fee ${feeMinor} does not fit a subtotal of ${subtotalMinor}`);
  const after = refundedBeforeMinor + amountMinor;
  if (after > subtotalMinor) throw new RangeError(`refunding ${amountMinor} after ${refundedBeforeMinor} exceeds the subtotal ${subtotalMinor}`);
  const feeBackBefore = mulDivRoundHalfUp(refundedBeforeMinor, feeMinor, subtotalMinor);
  const feeBackAfter = mulDivRoundHalfUp(after, feeMinor, subtotalMinor);
  const fee = feeBackAfter - feeBackBefore;
  return { feeMinor: fee, sellerMinor: amountMinor - fee };
}
