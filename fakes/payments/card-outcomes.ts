// What each test card does. The numbers are the provider's published test numbers
// (from memory); every other number is refused, as in the provider's test mode.

export type DeclineCode = "generic_decline" | "insufficient_funds";

export type CardOutcome =
  | { kind: "approved"; last4: string }
  | { kind: "declined"; last4: string; declineCode: DeclineCode; message: string };

export interface TestCard {
  number: string;
  grouped: string;
  effect: string;
  outcome: CardOutcome;
}

const DECLINED = "Your card was declined.";
const INSUFFICIENT = "Your card has insufficient funds.";

export const TEST_CARDS: readonly TestCard[] = [
  {
    number: "4242424242424242",
    grouped: "4242 4242 4242 4242",
    effect: "succeeds",
    outcome: { kind: "approved", last4: "4242" },
  },
  {
    number: "4000000000000002",
    grouped: "4000 0000 0000 0002",
    effect: "is declined",
    outcome: { kind: "declined", last4: "0002", declineCode: "generic_decline", message: DECLINED },
  },
  {
    number: "4000000000009995",
    grouped: "4000 0000 0000 9995",
    effect: "is declined for insufficient funds",
    outcome: { kind: "declined", last4: "9995", declineCode: "insufficient_funds", message: INSUFFICIENT },
  },
];

// The provider's ready-made test payment methods for server-side confirmation.
const TEST_PAYMENT_METHODS: Record<string, CardOutcome> = {
  pm_card_visa: { kind: "approved", last4: "4242" },
  pm_card_chargeDeclined: { kind: "declined", last4: "0002", declineCode: "generic_decline", message: DECLINED },
  pm_card_chargeDeclinedInsufficientFunds: {
    kind: "declined",
    last4: "9995",
    declineCode: "insufficient_funds",
    message: INSUFFICIENT,
  },
};

export function normaliseCardNumber(raw: string): string {
  return raw.replace(/[\s-]/g, "");
}

export function outcomeForCardNumber(raw: string): CardOutcome | undefined {
  const digits = normaliseCardNumber(raw);
  return TEST_CARDS.find((card) => card.number === digits)?.outcome;
}

export function outcomeForPaymentMethod(id: string): CardOutcome | undefined {
  return Object.hasOwn(TEST_PAYMENT_METHODS, id) ? TEST_PAYMENT_METHODS[id] : undefined;
}
