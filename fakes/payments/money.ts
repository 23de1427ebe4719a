// Currencies whose minor unit is the whole unit (the provider's zero-decimal list, from memory).
const ZERO_DECIMAL = new Set([
  "bif", "clp", "djf", "gnf", "jpy", "kmf", "krw", "mga", "pyg", "rwf", "ugx", "vnd", "vuv", "xaf", "xof", "xpf",
]);

// Smallest amount the provider accepts per charge (from memory; others left unchecked).
const MINIMUM_CHARGE: Record<string, number> = { usd: 50, eur: 50, gbp: 30, chf: 50, cad: 50, aud: 50 };

export function minimumCharge(currency: string): number {
  return MINIMUM_CHARGE[currency] ?? 1;
}

export function formatMinor(amount: number, currency: string): string {
  const exponent = ZERO_DECIMAL.has(currency) ? 0 : 2;
  try {
    return new Intl.NumberFormat("en", { style: "currency", currency: currency.toUpperCase() }).format(
      amount / 10 ** exponent,
    );
  } catch {
    return `${(amount / 10 ** exponent).toFixed(exponent)} ${currency.toUpperCase()}`;
  }
}
