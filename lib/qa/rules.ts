import type { PostState } from "@/db/schema/qa";
import type { Role } from "@/db/schema/users";
import { hasRole } from "@/lib/auth/access";

// The Q&A's pure rules: who waits for a moderator, when flags hide a post, who sees what.
// lib/qa/posting.ts, moderation.ts and votes.ts apply them inside transactions.

export type PostKind = "question" | "answer";

/** A member's posts wait in pre-moderation until this many of them have been approved. */
export const TRUSTED_AFTER_APPROVED_POSTS = 2;

/** Open (unresolved) flags at which a visible post is hidden until a moderator looks at it. */
export const HIDE_AT_OPEN_FLAGS = 3;

type Viewer = { id: string; roles: readonly Role[] } | null;

const asUser = (viewer: { id: string; roles: readonly Role[] }) => ({ id: viewer.id, email: null, name: null, roles: [...viewer.roles] });

export function isModerator(viewer: Viewer): boolean {
  return viewer !== null && hasRole(asUser(viewer), "moderator");
}

/**
 * Whether a new post waits for a moderator. Staff are trusted; everyone else until
 * TRUSTED_AFTER_APPROVED_POSTS of their posts have been approved (and are still up).
 */
export function needsPreModeration({ roles, approvedPosts }: { roles: readonly Role[]; approvedPosts: number }): boolean {
  if (roles.includes("moderator") || roles.includes("admin")) return false;
  return approvedPosts < TRUSTED_AFTER_APPROVED_POSTS;
}

export function initialPostState(author: { roles: readonly Role[]; approvedPosts: number }): Extract<PostState, "pending" | "visible"> {
  return needsPreModeration(author) ? "pending" : "visible";
}

/** A visible post is hidden once it has HIDE_AT_OPEN_FLAGS open flags; other states are left alone. */
export function shouldHide({ state, openFlags }: { state: PostState; openFlags: number }): boolean {
  return state === "visible" && openFlags >= HIDE_AT_OPEN_FLAGS;
}

/** Visible posts are public; a pending, hidden or removed one only to its author and the moderators. */
export function canSeePost(post: { state: PostState; authorId: string }, viewer: Viewer): boolean {
  if (post.state === "visible") return true;
  if (viewer === null) return false;
  return viewer.id === post.authorId || isModerator(viewer);
}

type Ordered = { id: string; score: number; createdAt: Date };

/** The accepted answer first, then the highest score, then the oldest (first to help). */
export function orderAnswers<A extends Ordered>(answers: readonly A[], acceptedAnswerId: string | null): A[] {
  return [...answers].sort((a, b) => {
    const accepted = Number(b.id === acceptedAnswerId) - Number(a.id === acceptedAnswerId);
    if (accepted !== 0) return accepted;
    if (b.score !== a.score) return b.score - a.score;
    return a.createdAt.getTime() - b.createdAt.getTime();
  });
}
