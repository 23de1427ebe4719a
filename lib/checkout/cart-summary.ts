// A cart as the buyer reads it: lines grouped by seller, totals per seller and per currency.
// Prices and stock come from the database on every read; this only arranges them.

export type CartLine = {
  listingId: string;
  slug: string;
  title: string;
  kind: "board" | "magnetic" | "kit";
  magneticSubtype: string | null;
  sellerId: string;
  shopName: string;
  priceMinor: number;
  currency: string;
  quantity: number;
  stock: number;
  live: boolean;
  mainsConnected: boolean;
};

/** Why a line cannot be bought as it stands; null when it can. */
export type LineProblem = "not-for-sale" | "out-of-stock" | "short" | null;

export function lineProblem(line: Pick<CartLine, "live" | "stock" | "quantity">): LineProblem {
  if (!line.live) return "not-for-sale";
  if (line.stock <= 0) return "out-of-stock";
  if (line.stock < line.quantity) return "short";
  return null;
}

export function lineProblemText(line: Pick<CartLine, "live" | "stock" | "quantity">): string | null {
  switch (lineProblem(line)) {
    case "not-for-sale":
      return "No longer for sale; remove it to continue.";
    case "out-of-stock":
      return "Out of stock; remove it to continue.";
    case "short":
      return `Only ${line.stock} left; lower the quantity to continue.`;
    default:
      return null;
  }
}

export type SellerGroup = { sellerId: string; shopName: string; currency: string; lines: CartLine[]; subtotalMinor: number };

export type CartSummary = {
  groups: SellerGroup[];
  /** one entry per currency in the cart, over the lines that can be bought */
  totals: { currency: string; totalMinor: number }[];
  itemCount: number;
  mixedCurrencies: boolean;
  /** every line can be bought in the quantity asked for */
  ready: boolean;
};

export function summariseCart(lines: readonly CartLine[]): CartSummary {
  const groups = new Map<string, SellerGroup>();
  const totals = new Map<string, number>();
  for (const line of lines) {
    const key = `${line.sellerId}\u0000${line.currency}`;
    let group = groups.get(key);
    if (!group) {
      group = { sellerId: line.sellerId, shopName: line.shopName, currency: line.currency, lines: [], subtotalMinor: 0 };
      groups.set(key, group);
    }
    group.lines.push(line);
    if (lineProblem(line) === null) {
      const amount = line.priceMinor * line.quantity;
      group.subtotalMinor += amount;
      totals.set(line.currency, (totals.get(line.currency) ?? 0) + amount);
    }
  }
  const currencies = new Set(lines.map((l) => l.currency));
  return {
    groups: [...groups.values()].sort((a, b) => a.shopName.localeCompare(b.shopName) || a.currency.localeCompare(b.currency)),
    totals: [...currencies].sort().map((currency) => ({ currency, totalMinor: totals.get(currency) ?? 0 })),
    itemCount: lines.reduce((n, l) => n + l.quantity, 0),
    mixedCurrencies: currencies.size > 1,
    ready: lines.length > 0 && lines.every((l) => lineProblem(l) === null),
  };
}

/** The message a buyer gets when a cart holds more than one currency: one payment is in one currency. */
export function mixedCurrencyMessage(currencies: readonly string[]): string {
  return `Your cart holds prices in ${currencies.join(" and ")}. One payment is made in one currency: remove the items in all but one currency (they can be bought in a separate checkout).`;
}
