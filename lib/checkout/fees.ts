// The platform's fee on a seller's subtotal, in integer minor units only.

export const BPS_PER_WHOLE = 10_000;

export type FeeSplit = { feeMinor: number; sellerShareMinor: number };

/**
 * fee = round-half-up(subtotal × feeBps / 10000), computed without floats: adding half the divisor
 * before the integer division rounds a remainder of exactly one half up. The share is the rest, so
 * fee + share = subtotal always, whatever the rounding did.
 */
export function splitFee(subtotalMinor: number, feeBps: number): FeeSplit {
  if (!Number.isSafeInteger(subtotalMinor) || subtotalMinor < 0) {
    throw new RangeError(`A subtotal must be a non-negative integer of minor units, got ${subtotalMinor}`);
  }
  if (!Number.isInteger(feeBps) || feeBps < 0 || feeBps > BPS_PER_WHOLE) {
    throw new RangeError(`A fee must be a whole number of basis points between 0 and ${BPS_PER_WHOLE}, got ${feeBps}`);
  }
  // BigInt keeps the product exact even for subtotals where subtotal × 10000 passes 2^53.
  const scaled = BigInt(subtotalMinor) * BigInt(feeBps);
  const divisor = BigInt(BPS_PER_WHOLE);
  const feeMinor = Number((scaled + divisor / 2n) / divisor);
  return { feeMinor, sellerShareMinor: subtotalMinor - feeMinor };
}

/** "8 %" or "8.5 %" for a fee in basis points, for the buyer's and seller's summaries. */
export function formatFeeRate(feeBps: number): string {
  const whole = Math.trunc(feeBps / 100);
  const rest = feeBps % 100;
  return rest === 0 ? `${whole} %` : `${whole}.${String(rest).padStart(2, "0").replace(/0$/, "")} %`;
}
