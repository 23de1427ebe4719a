import { cx } from "./cx";

export type StateTone = "neutral" | "active" | "clear" | "caution" | "stop";

export type StateEntry = { readonly label: string; readonly tone: StateTone };

/**
 * Every state the product shows, with the word a person reads and its tone. Keys are the
 * snake_case form of the product's words (`in review` → `in_review`); `productState` also
 * accepts the spaced or hyphenated form. Red ("stop") is kept for held listings and blocked
 * sheets; amber for what needs the owner's attention.
 */
export const PRODUCT_STATES = {
  listing: {
    draft: { label: "Draft", tone: "neutral" },
    in_review: { label: "In review", tone: "active" },
    live: { label: "Live", tone: "clear" },
    sent_back: { label: "Sent back", tone: "caution" },
    held: { label: "Held", tone: "stop" },
    retired: { label: "Retired", tone: "neutral" },
  },
  order: {
    awaiting_payment: { label: "Awaiting payment", tone: "neutral" },
    paid: { label: "Paid", tone: "active" },
    shipped: { label: "Shipped", tone: "active" },
    delivered: { label: "Delivered", tone: "clear" },
    refunded: { label: "Refunded", tone: "neutral" },
    cancelled: { label: "Cancelled", tone: "neutral" },
  },
  review: {
    requested: { label: "Requested", tone: "active" },
    accepted: { label: "Accepted", tone: "active" },
    delivered: { label: "Delivered", tone: "clear" },
    closed: { label: "Closed", tone: "neutral" },
    declined: { label: "Declined", tone: "neutral" },
    expired: { label: "Expired", tone: "neutral" },
    disputed: { label: "Disputed", tone: "caution" },
  },
  reading: {
    within: { label: "Within", tone: "clear" },
    low: { label: "Low", tone: "caution" },
    high: { label: "High", tone: "caution" },
  },
  policy: {
    clear: { label: "Clear", tone: "clear" },
    incomplete: { label: "Incomplete", tone: "caution" },
    blocked: { label: "Blocked", tone: "stop" },
  },
} as const satisfies Record<string, Record<string, StateEntry>>;

export type StateKind = keyof typeof PRODUCT_STATES;
export type StateKey<K extends StateKind> = keyof (typeof PRODUCT_STATES)[K] & string;

function normalise(state: string): string {
  return state.trim().toLowerCase().replace(/[\s-]+/g, "_");
}

/** Word and tone of a product state; an unknown state still shows its own words, neutrally. */
export function productState(kind: StateKind, state: string): StateEntry {
  const table: Record<string, StateEntry> = PRODUCT_STATES[kind];
  const known = table[normalise(state)];
  if (known) return known;
  const words = state.trim().replace(/[_-]+/g, " ");
  return { label: words.charAt(0).toUpperCase() + words.slice(1), tone: "neutral" };
}

const tones: Record<StateTone, string> = {
  neutral: "border-graphite-300 bg-graphite-100 text-graphite-700",
  active: "border-copper-300 bg-copper-100 text-copper-700",
  clear: "border-verdigris-300 bg-verdigris-50 text-verdigris-700",
  caution: "border-amber-300 bg-amber-50 text-amber-700",
  stop: "border-signal-300 bg-signal-50 text-signal-700",
};

export type StateBadgeProps = { label: string; tone?: StateTone; className?: string };

/** A state shown as its word; the tone only backs the word up, it never stands alone. */
export function StateBadge({ label, tone = "neutral", className }: StateBadgeProps) {
  return (
    <span
      data-tone={tone}
      className={cx(
        "inline-flex items-center rounded-sm border px-1.5 py-px text-xs font-semibold whitespace-nowrap",
        tones[tone],
        className,
      )}
    >
      {label}
    </span>
  );
}

export type ProductStateBadgeProps<K extends StateKind> = {
  kind: K;
  state: StateKey<K> | (string & {});
  className?: string;
};

export function ProductStateBadge<K extends StateKind>({ kind, state, className }: ProductStateBadgeProps<K>) {
  const entry = productState(kind, state);
  return <StateBadge label={entry.label} tone={entry.tone} className={className} />;
}
