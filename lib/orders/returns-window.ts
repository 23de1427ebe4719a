// When a buyer may still ask for a return: within the seller's window, counted in whole days from
// delivery (or from shipping while delivery is unconfirmed).
//
// Days are counted the way EU law counts periods in days (Regulation (EEC, Euratom) No 1182/71,
// art. 3(1) and 3(2)(b)): the day of the event itself does not count, the period starts at the
// beginning of the next day and ends with the last hour of its last day. The platform's days are UTC
// days. The extension to the next working day when the last day is a weekend or holiday (art. 3(4))
// is not applied: the window is the seller's own policy, shown to the buyer with its closing time.

const DAY_MS = 24 * 60 * 60 * 1000;

export type ReturnsWindowInput = { deliveredAt: Date | null; shippedAt: Date | null; windowDays: number };

/** The first instant at which a return can no longer be requested; null when nothing has shipped. */
export function returnsWindowClosesAt({ deliveredAt, shippedAt, windowDays }: ReturnsWindowInput): Date | null {
  if (!Number.isInteger(windowDays) || windowDays < 0) throw new RangeError(`returns window must be whole days ≥ 0, got ${windowDays}`);
  const start = deliveredAt ?? shippedAt;
  if (!start) return null;
  const dayOfEvent = Math.floor(start.getTime() / DAY_MS) * DAY_MS;
  // The event's day does not count: day 1 is the next day, and the window ends when day N ends.
  return new Date(dayOfEvent + (windowDays + 1) * DAY_MS);
}

export function isReturnsWindowOpen(input: ReturnsWindowInput, now: Date): boolean {
  const closesAt = returnsWindowClosesAt(input);
  return closesAt !== null && input.windowDays > 0 && now.getTime() < closesAt.getTime();
}
