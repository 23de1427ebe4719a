import type { PostState } from "@/db/schema/qa";
import type { Role } from "@/db/schema/users";
import { isModerator, type PostKind } from "./rules";

// What a moderator may do to a post, as pure rules; lib/qa/moderation.ts applies them.
//
//   pending ──approve──▶ visible ──(3 open flags)──▶ hidden ──restore──▶ visible
//      │                   │  ▲                        │
//      └──────remove───────┴──┴─restore (dismisses the flags of a visible post)
//                          └──────remove──────▶ removed ◀──remove──┘

export const POST_ACTIONS = ["approve", "remove", "restore"] as const;
export type PostAction = (typeof POST_ACTIONS)[number];

export type PostForModeration = { kind: PostKind; state: PostState; authorId: string; openFlags: number };

export type ModerationPlan =
  | { ok: true; from: PostState; to: PostState; resolvesFlags: boolean; audit: `${PostKind}.${"approved" | "removed" | "restored"}` }
  | { ok: false; status: 403 | 409 | 422; message: string };

const STATE_WORDS: Record<PostState, string> = {
  pending: "waiting for a moderator",
  visible: "visible",
  hidden: "hidden pending review",
  removed: "removed",
};

const PAST: Record<PostAction, "approved" | "removed" | "restored"> = { approve: "approved", remove: "removed", restore: "restored" };

export function planModeration({
  post,
  action,
  actor,
  reason,
}: {
  post: PostForModeration;
  action: PostAction;
  actor: { id: string; roles: readonly Role[] };
  reason?: string;
}): ModerationPlan {
  if (!isModerator(actor)) return { ok: false, status: 403, message: "Only a moderator can do that." };
  if (actor.id === post.authorId) return { ok: false, status: 403, message: "Nobody moderates their own post; another moderator must." };
  const conflict = (): ModerationPlan => ({
    ok: false,
    status: 409,
    message: `This ${post.kind} is ${STATE_WORDS[post.state]}, so it cannot be ${PAST[action]} now.`,
  });
  const audit = `${post.kind}.${PAST[action]}` as const;
  switch (action) {
    case "approve":
      return post.state === "pending" ? { ok: true, from: "pending", to: "visible", resolvesFlags: false, audit } : conflict();
    case "remove":
      if (post.state === "removed") return conflict();
      if (!reason || reason.trim().length < 3) return { ok: false, status: 422, message: "Say why the post is removed; its author reads this." };
      return { ok: true, from: post.state, to: "removed", resolvesFlags: true, audit };
    case "restore":
      // A visible post with open flags can be kept up: restoring it dismisses the flags.
      if (post.state === "hidden" || (post.state === "visible" && post.openFlags > 0)) {
        return { ok: true, from: post.state, to: "visible", resolvesFlags: true, audit };
      }
      return conflict();
  }
}

export type FlagPlan = { ok: true } | { ok: false; status: 403 | 404 | 409; message: string };

/** Whether a member may flag a post: only visible posts, never one's own; once per post is the database's unique index. */
export function planFlag({ post, flaggerId }: { post: { kind: PostKind; state: PostState; authorId: string }; flaggerId: string }): FlagPlan {
  if (post.authorId === flaggerId) return { ok: false, status: 403, message: `You cannot flag your own ${post.kind}.` };
  if (post.state === "hidden") return { ok: false, status: 409, message: `This ${post.kind} is already hidden while a moderator reviews it.` };
  if (post.state !== "visible") return { ok: false, status: 409, message: `This ${post.kind} is ${STATE_WORDS[post.state]}; only visible posts can be flagged.` };
  return { ok: true };
}
