import { describe, expect, it } from "vitest";
import { planAccept, planVote } from "@/lib/qa/answer-rules";
import { planFlag, planModeration } from "@/lib/qa/moderation-rules";

// The moderator's decisions of issue 6 ("moderators approve, remove (with a reason sent to the
// author) or restore"), the brief's reading of them (approve: pending → visible; restore: hidden →
// visible, resolving its flags), and the member rules (flag once, not your own; vote, not on your own
// answer; only the asker accepts).

const moderator = { id: "mod", roles: ["member", "moderator"] as const };
const post = (state: "pending" | "visible" | "hidden" | "removed", openFlags = 0) => ({ kind: "answer" as const, state, authorId: "author", openFlags });

describe("planModeration", () => {
  it("approves only a pending post, into visible", () => {
    expect(planModeration({ post: post("pending"), action: "approve", actor: moderator })).toMatchObject({ ok: true, from: "pending", to: "visible", audit: "answer.approved" });
    for (const state of ["visible", "hidden", "removed"] as const) {
      expect(planModeration({ post: post(state), action: "approve", actor: moderator }), state).toMatchObject({ ok: false, status: 409 });
    }
  });

  it("removes a post in any state but removed, and only with a reason", () => {
    for (const state of ["pending", "visible", "hidden"] as const) {
      expect(planModeration({ post: post(state), action: "remove", actor: moderator, reason: "Advises bridging the fuse." }), state).toMatchObject({
        ok: true,
        to: "removed",
        resolvesFlags: true,
      });
    }
    expect(planModeration({ post: post("visible"), action: "remove", actor: moderator })).toMatchObject({ ok: false, status: 422 });
    expect(planModeration({ post: post("visible"), action: "remove", actor: moderator, reason: "  " })).toMatchObject({ ok: false, status: 422 });
    expect(planModeration({ post: post("removed"), action: "remove", actor: moderator, reason: "Again." })).toMatchObject({ ok: false, status: 409 });
  });

  it("restores a hidden post (resolving its flags), or keeps a flagged visible one up; nothing else", () => {
    expect(planModeration({ post: post("hidden", 3), action: "restore", actor: moderator })).toMatchObject({ ok: true, from: "hidden", to: "visible", resolvesFlags: true });
    expect(planModeration({ post: post("visible", 1), action: "restore", actor: moderator })).toMatchObject({ ok: true, to: "visible", resolvesFlags: true });
    expect(planModeration({ post: post("visible", 0), action: "restore", actor: moderator })).toMatchObject({ ok: false, status: 409 });
    expect(planModeration({ post: post("pending"), action: "restore", actor: moderator })).toMatchObject({ ok: false, status: 409 });
    expect(planModeration({ post: post("removed"), action: "restore", actor: moderator })).toMatchObject({ ok: false, status: 409 });
  });

  it("refuses members (403) and a moderator's own post (403)", () => {
    expect(planModeration({ post: post("pending"), action: "approve", actor: { id: "x", roles: ["member", "seller"] } })).toMatchObject({ ok: false, status: 403 });
    expect(planModeration({ post: { ...post("pending"), authorId: "mod" }, action: "approve", actor: moderator })).toMatchObject({ ok: false, status: 403 });
    expect(planModeration({ post: post("pending"), action: "approve", actor: { id: "adm", roles: ["admin"] } })).toMatchObject({ ok: true });
  });
});

describe("planFlag", () => {
  it("lets a member flag someone else's visible post", () => {
    expect(planFlag({ post: { kind: "question", state: "visible", authorId: "author" }, flaggerId: "other" })).toEqual({ ok: true });
  });
  it("refuses one's own post, and posts that are not visible", () => {
    expect(planFlag({ post: { kind: "question", state: "visible", authorId: "author" }, flaggerId: "author" })).toMatchObject({ ok: false, status: 403 });
    for (const state of ["pending", "hidden", "removed"] as const) {
      expect(planFlag({ post: { kind: "answer", state, authorId: "author" }, flaggerId: "other" }), state).toMatchObject({ ok: false, status: 409 });
    }
  });
});

describe("planVote and planAccept", () => {
  it("refuses a vote on one's own answer and on answers or questions that are not visible", () => {
    expect(planVote({ answer: { state: "visible", authorId: "a" }, question: { state: "visible" }, voterId: "b" })).toEqual({ ok: true });
    expect(planVote({ answer: { state: "visible", authorId: "a" }, question: { state: "visible" }, voterId: "a" })).toMatchObject({ ok: false, status: 403 });
    expect(planVote({ answer: { state: "pending", authorId: "a" }, question: { state: "visible" }, voterId: "b" })).toMatchObject({ ok: false, status: 409 });
    expect(planVote({ answer: { state: "visible", authorId: "a" }, question: { state: "hidden" }, voterId: "b" })).toMatchObject({ ok: false, status: 409 });
  });

  it("lets only the asker accept, and only a visible answer of that question", () => {
    const question = { state: "visible" as const, authorId: "asker" };
    expect(planAccept({ question, answer: { state: "visible", questionMatches: true }, actorId: "asker" })).toEqual({ ok: true });
    expect(planAccept({ question, answer: { state: "visible", questionMatches: true }, actorId: "answerer" })).toMatchObject({ ok: false, status: 403 });
    expect(planAccept({ question, answer: { state: "visible", questionMatches: false }, actorId: "asker" })).toMatchObject({ ok: false, status: 409 });
    expect(planAccept({ question, answer: { state: "hidden", questionMatches: true }, actorId: "asker" })).toMatchObject({ ok: false, status: 409 });
    expect(planAccept({ question, actorId: "asker" })).toEqual({ ok: true });
  });
});
