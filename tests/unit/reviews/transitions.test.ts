import { describe, expect, it } from "vitest";
import { REVIEW_STATES, type ReviewState } from "@/db/schema/reviews";
import {
  availableActions,
  deliverBy,
  planReviewTransition,
  REVIEW_ACTIONS,
  type ReviewAction,
  type ReviewActor,
  type SessionFacts,
} from "@/lib/reviews/transitions";

// The rules come from the product brief (PRODUCT.md, journey 3 and "Review session states") and
// issue 6 ("Reviewers and paid review sessions"): the reviewer accepts or declines within 48 hours,
// no answer expires it, delivering captures, the builder may dispute within 7 days, a moderator
// settles, and sessions with no dispute after 7 days close.

const HOUR = 3_600_000;
const booked = new Date("2026-03-02T09:00:00Z");
const builder: ReviewActor = { kind: "user", id: "builder-1", roles: ["member"] };
const reviewer: ReviewActor = { kind: "user", id: "reviewer-1", roles: ["member", "reviewer"] };
const moderator: ReviewActor = { kind: "user", id: "moderator-1", roles: ["member", "moderator"] };
const system: ReviewActor = { kind: "system" };

function session(state: ReviewState, overrides: Partial<SessionFacts> = {}): SessionFacts {
  return {
    state,
    builderId: "builder-1",
    reviewerId: "reviewer-1",
    createdAt: booked,
    respondBy: new Date(booked.getTime() + 48 * HOUR),
    disputeBy: state === "delivered" || state === "disputed" || state === "closed" ? new Date(booked.getTime() + 30 * HOUR + 7 * 24 * HOUR) : null,
    ...overrides,
  };
}

// For each action: who does it and a moment at which its deadline allows it.
const when: Record<ReviewAction, { actor: ReviewActor; at: (s: SessionFacts) => Date }> = {
  accept: { actor: reviewer, at: () => new Date(booked.getTime() + 2 * HOUR) },
  decline: { actor: reviewer, at: () => new Date(booked.getTime() + 2 * HOUR) },
  expire: { actor: system, at: (s) => new Date(Math.max(s.respondBy.getTime(), deliverBy(s).getTime()) + HOUR) },
  deliver: { actor: reviewer, at: () => new Date(booked.getTime() + 30 * HOUR) },
  dispute: { actor: builder, at: () => new Date(booked.getTime() + 40 * HOUR) },
  close: { actor: system, at: (s) => new Date((s.disputeBy ?? booked).getTime() + HOUR) },
  settle: { actor: moderator, at: () => new Date(booked.getTime() + 100 * HOUR) },
};

// The only allowed moves, from the brief's state list; everything else must be refused.
const ALLOWED: Record<ReviewAction, Partial<Record<ReviewState, ReviewState>>> = {
  accept: { requested: "accepted" },
  decline: { requested: "declined" },
  expire: { requested: "expired", accepted: "expired" },
  deliver: { accepted: "delivered" },
  dispute: { delivered: "disputed" },
  close: { delivered: "closed" },
  settle: { disputed: "closed" },
};

describe("every state × every action", () => {
  for (const action of REVIEW_ACTIONS) {
    for (const state of REVIEW_STATES) {
      const target = ALLOWED[action][state];
      it(`${action} from ${state}: ${target ? `→ ${target}` : "refused (409)"}`, () => {
        const s = session(state);
        const plan = planReviewTransition({ session: s, action, actor: when[action].actor, now: when[action].at(s) });
        if (target) {
          expect(plan).toMatchObject({ ok: true, from: state, to: target });
        } else {
          expect(plan).toMatchObject({ ok: false, status: 409 });
        }
      });
    }
  }

  it("refuses leaving the end states declined, expired and closed in any way", () => {
    for (const state of ["declined", "expired", "closed"] as const) {
      for (const action of REVIEW_ACTIONS) {
        const s = session(state);
        expect(planReviewTransition({ session: s, action, actor: when[action].actor, now: when[action].at(s) }).ok).toBe(false);
      }
    }
  });
});

describe("who may act", () => {
  it("a builder cannot deliver a report, accept or decline", () => {
    const s = session("accepted");
    expect(planReviewTransition({ session: s, action: "deliver", actor: builder, now: when.deliver.at(s) })).toMatchObject({ ok: false, status: 403 });
    const r = session("requested");
    expect(planReviewTransition({ session: r, action: "accept", actor: builder, now: when.accept.at(r) })).toMatchObject({ ok: false, status: 403 });
    expect(planReviewTransition({ session: r, action: "decline", actor: builder, now: when.decline.at(r) })).toMatchObject({ ok: false, status: 403 });
  });

  it("another reviewer cannot act on someone else's session, nor can the reviewer once the role is taken away", () => {
    const r = session("requested");
    const other: ReviewActor = { kind: "user", id: "reviewer-2", roles: ["reviewer"] };
    expect(planReviewTransition({ session: r, action: "accept", actor: other, now: when.accept.at(r) })).toMatchObject({ ok: false, status: 403 });
    const demoted: ReviewActor = { kind: "user", id: "reviewer-1", roles: ["member"] };
    expect(planReviewTransition({ session: r, action: "accept", actor: demoted, now: when.accept.at(r) })).toMatchObject({ ok: false, status: 403 });
  });

  it("only the builder disputes; the reviewer and a moderator cannot", () => {
    const s = session("delivered");
    expect(planReviewTransition({ session: s, action: "dispute", actor: reviewer, now: when.dispute.at(s) })).toMatchObject({ ok: false, status: 403 });
    expect(planReviewTransition({ session: s, action: "dispute", actor: moderator, now: when.dispute.at(s) })).toMatchObject({ ok: false, status: 403 });
  });

  it("only a moderator who is not a party settles; admins count as moderators", () => {
    const s = session("disputed");
    const at = when.settle.at(s);
    expect(planReviewTransition({ session: s, action: "settle", actor: builder, now: at })).toMatchObject({ ok: false, status: 403 });
    expect(planReviewTransition({ session: s, action: "settle", actor: reviewer, now: at })).toMatchObject({ ok: false, status: 403 });
    const party: ReviewActor = { kind: "user", id: "builder-1", roles: ["moderator"] };
    expect(planReviewTransition({ session: s, action: "settle", actor: party, now: at })).toMatchObject({ ok: false, status: 403 });
    const admin: ReviewActor = { kind: "user", id: "admin-1", roles: ["admin"] };
    expect(planReviewTransition({ session: s, action: "settle", actor: admin, now: at })).toMatchObject({ ok: true, to: "closed", money: "settle" });
  });

  it("expiry and closing are the platform's alone", () => {
    const r = session("requested");
    const late = new Date(r.respondBy.getTime() + HOUR);
    expect(planReviewTransition({ session: r, action: "expire", actor: reviewer, now: late })).toMatchObject({ ok: false, status: 403 });
    const d = session("delivered");
    expect(planReviewTransition({ session: d, action: "close", actor: moderator, now: when.close.at(d) })).toMatchObject({ ok: false, status: 403 });
  });
});

describe("deadlines", () => {
  it("accepting works until the 48th hour and not at it", () => {
    const r = session("requested");
    const justBefore = new Date(booked.getTime() + 48 * HOUR - 1);
    const atDeadline = new Date(booked.getTime() + 48 * HOUR);
    expect(planReviewTransition({ session: r, action: "accept", actor: reviewer, now: justBefore }).ok).toBe(true);
    expect(planReviewTransition({ session: r, action: "accept", actor: reviewer, now: atDeadline })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: r, action: "expire", actor: system, now: justBefore })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: r, action: "expire", actor: system, now: atDeadline })).toMatchObject({ ok: true, to: "expired", money: "release" });
  });

  it("an accepted session with no report by the delivery deadline expires, and a late report is refused", () => {
    const a = session("accepted");
    const due = deliverBy(a);
    expect(due.getTime() - booked.getTime()).toBe(6 * 24 * HOUR);
    expect(planReviewTransition({ session: a, action: "deliver", actor: reviewer, now: new Date(due.getTime() - 1) })).toMatchObject({ ok: true, money: "capture" });
    expect(planReviewTransition({ session: a, action: "deliver", actor: reviewer, now: due })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: a, action: "expire", actor: system, now: new Date(due.getTime() - 1) })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: a, action: "expire", actor: system, now: due })).toMatchObject({ ok: true, to: "expired" });
  });

  it("disputes are open for 7 days after delivery; then only closing is possible", () => {
    const delivered = new Date(booked.getTime() + 30 * HOUR);
    const d = session("delivered", { disputeBy: new Date(delivered.getTime() + 7 * 24 * HOUR) });
    const last = new Date(d.disputeBy!.getTime() - 1);
    expect(planReviewTransition({ session: d, action: "dispute", actor: builder, now: last })).toMatchObject({ ok: true, to: "disputed" });
    expect(planReviewTransition({ session: d, action: "close", actor: system, now: last })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: d, action: "dispute", actor: builder, now: d.disputeBy! })).toMatchObject({ ok: false, status: 409 });
    expect(planReviewTransition({ session: d, action: "close", actor: system, now: d.disputeBy! })).toMatchObject({ ok: true, to: "closed", money: "none" });
  });
});

describe("availableActions", () => {
  it("offers the reviewer accept and decline on a fresh request, and the builder nothing", () => {
    const r = session("requested");
    const at = new Date(booked.getTime() + HOUR);
    expect(availableActions(r, reviewer, at)).toEqual(["accept", "decline"]);
    expect(availableActions(r, builder, at)).toEqual([]);
  });

  it("offers the builder a dispute on a delivered report, and the reviewer nothing", () => {
    const d = session("delivered");
    expect(availableActions(d, builder, when.dispute.at(d))).toEqual(["dispute"]);
    expect(availableActions(d, reviewer, when.dispute.at(d))).toEqual([]);
  });
});
