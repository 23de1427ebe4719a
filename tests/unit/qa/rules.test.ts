import { describe, expect, it } from "vitest";
import { canSeePost, HIDE_AT_OPEN_FLAGS, initialPostState, needsPreModeration, orderAnswers, shouldHide, TRUSTED_AFTER_APPROVED_POSTS } from "@/lib/qa/rules";

// The rules are those of issue 6 ("Q&A — Moderation") and its work brief: a new member's first posts
// (fewer than 2 approved so far) wait in pre-moderation; a post with 3 open flags is hidden pending
// review; pending, hidden and removed posts are seen only by their author and the moderators.

describe("pre-moderation", () => {
  it("holds a member's posts until two of them are approved (issue 6 brief: fewer than 2 approved posts)", () => {
    expect(TRUSTED_AFTER_APPROVED_POSTS).toBe(2);
    expect(needsPreModeration({ roles: ["member"], approvedPosts: 0 })).toBe(true);
    expect(needsPreModeration({ roles: ["member"], approvedPosts: 1 })).toBe(true);
    expect(needsPreModeration({ roles: ["member"], approvedPosts: 2 })).toBe(false);
    expect(needsPreModeration({ roles: ["member"], approvedPosts: 40 })).toBe(false);
    expect(initialPostState({ roles: ["member"], approvedPosts: 1 })).toBe("pending");
    expect(initialPostState({ roles: ["member"], approvedPosts: 2 })).toBe("visible");
  });

  it("holds sellers and reviewers like any member, but not the staff who moderate the queue", () => {
    expect(needsPreModeration({ roles: ["member", "seller"], approvedPosts: 0 })).toBe(true);
    expect(needsPreModeration({ roles: ["member", "reviewer"], approvedPosts: 0 })).toBe(true);
    expect(needsPreModeration({ roles: ["member", "moderator"], approvedPosts: 0 })).toBe(false);
    expect(needsPreModeration({ roles: ["admin"], approvedPosts: 0 })).toBe(false);
  });
});

describe("the hide threshold", () => {
  it("hides a visible post at the third open flag, not before (issue 6 brief: 3 open flags)", () => {
    expect(HIDE_AT_OPEN_FLAGS).toBe(3);
    expect(shouldHide({ state: "visible", openFlags: 0 })).toBe(false);
    expect(shouldHide({ state: "visible", openFlags: 2 })).toBe(false);
    expect(shouldHide({ state: "visible", openFlags: 3 })).toBe(true);
    expect(shouldHide({ state: "visible", openFlags: 4 })).toBe(true);
  });

  it("leaves posts that are not visible alone: a removed post is not brought back to hidden", () => {
    expect(shouldHide({ state: "removed", openFlags: 5 })).toBe(false);
    expect(shouldHide({ state: "pending", openFlags: 5 })).toBe(false);
    expect(shouldHide({ state: "hidden", openFlags: 5 })).toBe(false);
  });
});

describe("who sees a post", () => {
  const author = { id: "author", roles: ["member" as const] };
  const other = { id: "other", roles: ["member" as const] };
  const moderator = { id: "mod", roles: ["moderator" as const] };
  const admin = { id: "adm", roles: ["admin" as const] };

  it("shows visible posts to everyone, visitors included", () => {
    for (const viewer of [null, author, other, moderator]) expect(canSeePost({ state: "visible", authorId: "author" }, viewer)).toBe(true);
  });

  it("shows pending, hidden and removed posts only to the author and moderators (admins count as moderators)", () => {
    for (const state of ["pending", "hidden", "removed"] as const) {
      expect(canSeePost({ state, authorId: "author" }, null), state).toBe(false);
      expect(canSeePost({ state, authorId: "author" }, other), state).toBe(false);
      expect(canSeePost({ state, authorId: "author" }, author), state).toBe(true);
      expect(canSeePost({ state, authorId: "author" }, moderator), state).toBe(true);
      expect(canSeePost({ state, authorId: "author" }, admin), state).toBe(true);
    }
  });
});

describe("answer order (issue 6 brief: accepted first, then score)", () => {
  const at = (minute: number) => new Date(Date.UTC(2025, 0, 1, 12, minute));
  const answers = [
    { id: "a", score: 5, createdAt: at(1) },
    { id: "b", score: 1, createdAt: at(2) },
    { id: "c", score: 5, createdAt: at(0) },
    { id: "d", score: -2, createdAt: at(3) },
  ];

  it("puts the accepted answer first even with a lower score, then by score, ties oldest first", () => {
    expect(orderAnswers(answers, "b").map((a) => a.id)).toEqual(["b", "c", "a", "d"]);
    expect(orderAnswers(answers, "d").map((a) => a.id)).toEqual(["d", "c", "a", "b"]);
  });

  it("orders by score alone when none is accepted, and leaves its input untouched", () => {
    expect(orderAnswers(answers, null).map((a) => a.id)).toEqual(["c", "a", "b", "d"]);
    expect(answers.map((a) => a.id)).toEqual(["a", "b", "c", "d"]);
  });
});
