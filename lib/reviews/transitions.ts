import type { Role } from "@/db/schema/users";
import type { ReviewState } from "@/db/schema/reviews";
import { hasRole } from "@/lib/auth/access";

// The review session's life as pure rules; db/queries/reviews.ts applies them with conditional updates.
//
//   (paid: authorised) ─▶ requested ──accept (reviewer, within 48 h)──▶ accepted ──deliver (reviewer)──▶ delivered
//                            │  │                                          │                             │   │
//                            │  └─decline (reviewer)─▶ declined            └─expire (system, no report   │   └─dispute (builder, within 7 days)─▶ disputed
//                            └──expire (system, 48 h passed)─▶ expired        by the delivery deadline)   │                                       │
//                                                                              ─▶ expired                 └─close (system, 7 days passed)─▶ closed ◀─settle (moderator)─┘
//
// Money follows the state: declined and expired release the authorisation, delivered captures it,
// a settled dispute may refund part or all of it.

export const REVIEW_ACTIONS = ["accept", "decline", "expire", "deliver", "dispute", "close", "settle"] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

export const HOUR_MS = 3_600_000;
/** The reviewer answers a request within 48 hours (the rule). */
export const RESPOND_WINDOW_MS = 48 * HOUR_MS;
/** The builder may dispute a delivered report for 7 days (the rule). */
export const DISPUTE_WINDOW_MS = 7 * 24 * HOUR_MS;
/**
 * A card authorisation is commonly held for about 7 days before the card's bank lets it lapse
 * (common practice, not a figure from the payments fake); the report is due a day before that so
 * the capture still finds the money held.
 */
export const DELIVERY_WINDOW_MS = 6 * 24 * HOUR_MS;

export type ReviewActor = { kind: "user"; id: string; roles: readonly Role[] } | { kind: "system" };

export type SessionFacts = {
  state: ReviewState;
  builderId: string;
  reviewerId: string;
  /** when the authorisation was recorded; the delivery deadline runs from here */
  createdAt: Date;
  respondBy: Date;
  disputeBy: Date | null;
};

export type MoneyStep = "none" | "release" | "capture" | "settle";

type Rule = { from: readonly ReviewState[]; to: ReviewState; by: "reviewer" | "builder" | "moderator" | "system"; money: MoneyStep };

export const REVIEW_TRANSITIONS: Record<ReviewAction, Rule> = {
  accept: { from: ["requested"], to: "accepted", by: "reviewer", money: "none" },
  decline: { from: ["requested"], to: "declined", by: "reviewer", money: "release" },
  expire: { from: ["requested", "accepted"], to: "expired", by: "system", money: "release" },
  deliver: { from: ["accepted"], to: "delivered", by: "reviewer", money: "capture" },
  dispute: { from: ["delivered"], to: "disputed", by: "builder", money: "none" },
  close: { from: ["delivered"], to: "closed", by: "system", money: "none" },
  settle: { from: ["disputed"], to: "closed", by: "moderator", money: "settle" },
};

export type ReviewPlan =
  | { ok: true; from: ReviewState; to: ReviewState; money: MoneyStep }
  | { ok: false; status: 403 | 409; message: string };

export function deliverBy(session: Pick<SessionFacts, "createdAt">): Date {
  return new Date(session.createdAt.getTime() + DELIVERY_WINDOW_MS);
}

export function respondByFrom(authorisedAt: Date): Date {
  return new Date(authorisedAt.getTime() + RESPOND_WINDOW_MS);
}

export function disputeByFrom(deliveredAt: Date): Date {
  return new Date(deliveredAt.getTime() + DISPUTE_WINDOW_MS);
}

const STATE_WORDS: Record<ReviewState, string> = {
  requested: "still waiting for the reviewer's answer",
  accepted: "accepted and waiting for the report",
  delivered: "delivered",
  closed: "closed",
  declined: "declined",
  expired: "expired",
  disputed: "disputed and waiting for a moderator",
};

const ACTION_WORDS: Record<ReviewAction, string> = {
  accept: "accepted",
  decline: "declined",
  expire: "expired",
  deliver: "given a report",
  dispute: "disputed",
  close: "closed",
  settle: "settled",
};

function whoMayAct(rule: Rule, session: SessionFacts, actor: ReviewActor): string | null {
  if (rule.by === "system") return actor.kind === "system" ? null : "Only the platform itself does this, when the time has run out.";
  if (actor.kind !== "user") return "A person must do this.";
  const user = { id: actor.id, email: null, name: null, roles: [...actor.roles] };
  switch (rule.by) {
    case "reviewer":
      return actor.id === session.reviewerId && hasRole(user, "reviewer") ? null : "Only the reviewer of this session can do that.";
    case "builder":
      return actor.id === session.builderId ? null : "Only the builder who booked this review can do that.";
    case "moderator":
      if (!hasRole(user, "moderator")) return "Only a moderator can settle a dispute.";
      if (actor.id === session.builderId || actor.id === session.reviewerId) return "Nobody settles a dispute they are part of; another moderator must.";
      return null;
  }
}

/** The clock's part: what the deadlines allow at `now`; null when the action may go ahead. */
function timing(action: ReviewAction, session: SessionFacts, now: Date): string | null {
  const t = now.getTime();
  switch (action) {
    case "accept":
      return t < session.respondBy.getTime() ? null : "The 48 hours to answer this request have passed; it expires and the builder's payment is released.";
    case "deliver":
      return t < deliverBy(session).getTime() ? null : "The report was due before the payment hold runs out; this session expires and the payment is released.";
    case "expire":
      if (session.state === "requested") return t >= session.respondBy.getTime() ? null : "The reviewer still has time to answer.";
      return t >= deliverBy(session).getTime() ? null : "The reviewer still has time to deliver the report.";
    case "dispute":
      return session.disputeBy && t < session.disputeBy.getTime() ? null : "The 7 days to dispute this report have passed; the session is closed.";
    case "close":
      return session.disputeBy && t >= session.disputeBy.getTime() ? null : "The builder can still dispute this report.";
    default:
      return null;
  }
}

export function planReviewTransition({ session, action, actor, now }: { session: SessionFacts; action: ReviewAction; actor: ReviewActor; now: Date }): ReviewPlan {
  const rule = REVIEW_TRANSITIONS[action];
  const refusal = whoMayAct(rule, session, actor);
  if (refusal) return { ok: false, status: 403, message: refusal };
  if (!rule.from.includes(session.state)) {
    return { ok: false, status: 409, message: `This review session is ${STATE_WORDS[session.state]}, so it cannot be ${ACTION_WORDS[action]} now.` };
  }
  const late = timing(action, session, now);
  if (late) return { ok: false, status: 409, message: late };
  return { ok: true, from: session.state, to: rule.to, money: rule.money };
}

/** What a person on the session may do now, for showing the right buttons (the server re-checks). */
export function availableActions(session: SessionFacts, actor: ReviewActor, now: Date): ReviewAction[] {
  return REVIEW_ACTIONS.filter((action) => planReviewTransition({ session, action, actor, now }).ok);
}
