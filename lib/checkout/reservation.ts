// How long stock is held for an open checkout.

/** The provider accepts a session expiry no sooner than 30 minutes after it creates the session. */
export const PROVIDER_MIN_EXPIRY_MS = 30 * 60 * 1000;

/**
 * The hold starts in our transaction and the provider's 30 minutes start a moment later, when it
 * creates the session; the extra minute keeps `expires_at` (= the hold's end) inside its window
 * even when that call is slow or retried once.
 */
export const RESERVATION_HOLD_MS = PROVIDER_MIN_EXPIRY_MS + 60 * 1000;

export function reservationExpiry(now: Date): Date {
  return new Date(now.getTime() + RESERVATION_HOLD_MS);
}

/** The sweep leaves a due hold to the provider's own expiry event for this long before releasing it itself. */
export const SWEEP_GRACE_MS = 2 * 60 * 1000;
