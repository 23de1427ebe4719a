import type { Role } from "@/db/schema/users";
import type { ListingState } from "@/db/schema/listings";
import type { ListingDecisionKind, TopicReason } from "@/db/schema/moderation";
import { hasRole } from "@/lib/auth/access";

// The listing life cycle as pure rules; db/queries/listing-transitions.ts applies them in a transaction.
//
//   draft ──submit──▶ in review ──approve──▶ live ──hold──▶ held ──restore──▶ live
//     ▲                  │                   │  ▲                 │
//     └──── sent back ◀──┘ send back         │  └─ grace expired ─┘ (system)
//            └──submit──▶ in review           └─ edit of sheet or figures ──▶ in review
//   any state but retired ──retire (seller)──▶ retired

export const LISTING_ACTIONS = ["submit", "approve", "send_back", "hold", "restore", "retire", "resubmit_after_edit", "expire_grace"] as const;
export type ListingAction = (typeof LISTING_ACTIONS)[number];

export type TransitionActor = { kind: "user"; id: string; roles: readonly Role[] } | { kind: "system" };

type Rule = {
  from: readonly ListingState[];
  to: ListingState;
  by: "owner" | "moderator" | "system";
  decision: ListingDecisionKind;
  needsReason?: "per-topic" | "text";
};

export const TRANSITIONS: Record<ListingAction, Rule> = {
  submit: { from: ["draft", "sent_back"], to: "in_review", by: "owner", decision: "submitted" },
  resubmit_after_edit: { from: ["live"], to: "in_review", by: "owner", decision: "submitted" },
  approve: { from: ["in_review"], to: "live", by: "moderator", decision: "approved" },
  send_back: { from: ["in_review"], to: "sent_back", by: "moderator", decision: "sent_back", needsReason: "per-topic" },
  hold: { from: ["live"], to: "held", by: "moderator", decision: "held", needsReason: "text" },
  restore: { from: ["held"], to: "live", by: "moderator", decision: "restored" },
  retire: { from: ["draft", "in_review", "live", "sent_back", "held"], to: "retired", by: "owner", decision: "retired" },
  expire_grace: { from: ["live"], to: "held", by: "system", decision: "grace_expired" },
};

export type TransitionRequest = {
  listing: { state: ListingState; sellerId: string };
  action: ListingAction;
  actor: TransitionActor;
  reasons?: TopicReason[];
  note?: string;
};

export type TransitionPlan =
  | { ok: true; from: ListingState; to: ListingState; decision: ListingDecisionKind }
  | { ok: false; status: 403 | 409 | 422; message: string };

const STATE_WORDS: Record<ListingState, string> = {
  draft: "a draft",
  in_review: "in review",
  live: "live",
  sent_back: "sent back",
  held: "held",
  retired: "retired",
};

export function planTransition({ listing, action, actor, reasons = [], note }: TransitionRequest): TransitionPlan {
  const rule = TRANSITIONS[action];
  if (rule.by === "system" && actor.kind !== "system") return { ok: false, status: 403, message: "Only the platform itself does this." };
  if (rule.by !== "system") {
    if (actor.kind !== "user") return { ok: false, status: 403, message: "A person must do this." };
    const user = { id: actor.id, email: null, name: null, roles: [...actor.roles] };
    if (rule.by === "owner" && actor.id !== listing.sellerId) {
      return { ok: false, status: 403, message: "Only the seller who owns this listing can do that." };
    }
    if (rule.by === "moderator") {
      if (!hasRole(user, "moderator")) return { ok: false, status: 403, message: "Only a moderator can do that." };
      if (actor.id === listing.sellerId) return { ok: false, status: 403, message: "Nobody moderates their own listing; another moderator must." };
    }
  }
  if (!rule.from.includes(listing.state)) {
    return { ok: false, status: 409, message: `This listing is ${STATE_WORDS[listing.state]}, so it cannot be ${describe(action)} now.` };
  }
  if (rule.needsReason === "per-topic" && (reasons.length === 0 || reasons.some((r) => r.text.trim().length < 3))) {
    return { ok: false, status: 422, message: "Give at least one reason, naming the topic and what the seller must change." };
  }
  if (rule.needsReason === "text" && (!note || note.trim().length < 3)) {
    return { ok: false, status: 422, message: "Say why the listing is held; the seller reads this." };
  }
  return { ok: true, from: listing.state, to: rule.to, decision: rule.decision };
}

function describe(action: ListingAction): string {
  const words: Record<ListingAction, string> = {
    submit: "submitted for review",
    resubmit_after_edit: "sent back to review",
    approve: "approved",
    send_back: "sent back",
    hold: "held",
    restore: "restored",
    retire: "retired",
    expire_grace: "held for an expired grace period",
  };
  return words[action];
}
