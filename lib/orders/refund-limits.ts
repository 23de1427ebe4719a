// How much of an order line can still go back to the buyer. "Reserved" counts every refund recorded
// against the line, settled or still waiting for the payment provider, so two refunds racing for the
// same money can never both pass.

export type LineAmounts = { unitPriceMinor: number; quantity: number };

export function lineTotalMinor({ unitPriceMinor, quantity }: LineAmounts): number {
  const total = unitPriceMinor * quantity;
  if (!Number.isSafeInteger(total) || total < 0) throw new RangeError(`line total ${unitPriceMinor} × ${quantity} is not a safe amount`);
  return total;
}

export function remainingRefundableMinor(line: LineAmounts, reservedMinor: number): number {
  return Math.max(0, lineTotalMinor(line) - reservedMinor);
}

export type LineRefundCheck =
  | { ok: true; remainingAfterMinor: number }
  | { ok: false; reason: "not_positive" | "nothing_left" | "too_large"; remainingMinor: number };

export function checkLineRefund({ line, reservedMinor, amountMinor }: { line: LineAmounts; reservedMinor: number; amountMinor: number }): LineRefundCheck {
  const remaining = remainingRefundableMinor(line, reservedMinor);
  if (!Number.isSafeInteger(amountMinor) || amountMinor <= 0) return { ok: false, reason: "not_positive", remainingMinor: remaining };
  if (remaining === 0) return { ok: false, reason: "nothing_left", remainingMinor: 0 };
  if (amountMinor > remaining) return { ok: false, reason: "too_large", remainingMinor: remaining };
  return { ok: true, remainingAfterMinor: remaining - amountMinor };
}
