import type { Role } from "@/db/schema/users";
import type { ReviewState } from "@/db/schema/reviews";
import { effectiveRoles } from "@/lib/auth/access";

/** Who is looking at a log; null for a visitor. */
export type LogViewer = { id: string; roles: readonly Role[] } | null;

/** Why a viewer may read a log; only the owner may change it. */
export type LogAccess = "owner" | "reviewer" | "moderator" | "public";

/**
 * A review session shares the log with its reviewer once they have accepted it, and keeps it
 * shared for the report, the dispute window and afterwards (read-only). A request they have not
 * accepted, declined or let expire shares nothing.
 */
export const REVIEWER_READ_STATES = ["accepted", "delivered", "closed", "disputed"] as const satisfies readonly ReviewState[];

export type LogAccessFacts = {
  viewer: LogViewer;
  ownerId: string;
  visibility: "private" | "public";
  /** states of the viewer's own review sessions on this log, as reviewer */
  reviewerSessionStates: readonly ReviewState[];
};

/** The access rule of bring-up logs; null means "not found" to this viewer, so a private log's existence stays hidden. */
export function decideLogAccess(facts: LogAccessFacts): LogAccess | null {
  const { viewer } = facts;
  if (viewer && viewer.id === facts.ownerId) return "owner";
  if (viewer && facts.reviewerSessionStates.some((s) => (REVIEWER_READ_STATES as readonly ReviewState[]).includes(s))) return "reviewer";
  if (viewer && effectiveRoles(viewer.roles).has("moderator")) return "moderator";
  if (facts.visibility === "public") return "public";
  return null;
}
