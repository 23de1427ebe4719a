import type { ReviewState } from "@/db/schema/reviews";
import type { LogAccess } from "@/lib/bench/log-access";

// Who pins comments to a capture's trace and who reads them. Pure, shared by the queries and the pages.

/** A reviewer pins while writing the report and after delivering it, until the session closes. */
export const PIN_STATES = ["accepted", "delivered"] as const satisfies readonly ReviewState[];

export const MAX_PIN_BODY = 2000;

export type PinSessionFacts = { reviewerId: string; logId: string; state: ReviewState };

export type PinDecision = { ok: true } | { ok: false; status: 403 | 404 | 409; message: string };

export function decidePin({ actorId, session, captureLogId }: { actorId: string; session: PinSessionFacts | null; captureLogId: string }): PinDecision {
  // Someone else's session, or one on another log, is not theirs to pin in: it does not exist for them.
  if (!session || session.reviewerId !== actorId) return { ok: false, status: 404, message: "There is no such review session of yours." };
  if (session.logId !== captureLogId) return { ok: false, status: 404, message: "That capture is not part of the log under review." };
  if (!(PIN_STATES as readonly ReviewState[]).includes(session.state)) {
    return { ok: false, status: 409, message: "Comments can be pinned while the review is accepted or delivered, not after it closes." };
  }
  return { ok: true };
}

/**
 * Which pins a reader of the capture sees: the builder and moderators all of them; a reviewer
 * those of their own sessions; a visitor of a public log none (a review is between its two parties).
 */
export function pinScope(access: LogAccess): "all" | "own-sessions" | "none" {
  switch (access) {
    case "owner":
    case "moderator":
      return "all";
    case "reviewer":
      return "own-sessions";
    case "public":
      return "none";
  }
}
