import type { FakeState } from "../state";

/**
 * The platform's balance per currency: captured charges less refunds and transfers,
 * plus transfer reversals. Processing fees and pending periods are left out: every
 * captured amount is available at once.
 */
export function availableBalance(state: FakeState): Map<string, number> {
  const totals = new Map<string, number>();
  const add = (currency: string, amount: number) => totals.set(currency, (totals.get(currency) ?? 0) + amount);
  for (const charge of Object.values(state.charges)) {
    if (charge.captured) add(charge.currency, charge.amount_captured);
  }
  for (const refund of Object.values(state.refunds)) add(refund.currency, -refund.amount);
  for (const transfer of Object.values(state.transfers)) add(transfer.currency, -(transfer.amount - transfer.amount_reversed));
  return totals;
}

export function balanceObject(state: FakeState): unknown {
  const totals = availableBalance(state);
  const currencies = totals.size > 0 ? [...totals.keys()] : ["usd"];
  return {
    object: "balance",
    available: currencies.map((currency) => ({
      amount: totals.get(currency) ?? 0,
      currency,
      source_types: { card: totals.get(currency) ?? 0 },
    })),
    pending: currencies.map((currency) => ({ amount: 0, currency, source_types: { card: 0 } })),
    livemode: false,
  };
}
