import type { PostState } from "@/db/schema/qa";
import { Alert } from "@/components/ui/alert";
import type { PostKind } from "@/lib/qa/rules";

/**
 * What the author (or a moderator) reads on a post that others cannot see. Visible posts need no
 * note; the others say who can see them and why.
 */
export function PostStateNote({ kind, state, removalReason, mine }: { kind: PostKind; state: PostState; removalReason: string | null; mine: boolean }) {
  if (state === "visible") return null;
  const subject = mine ? `Your ${kind}` : `This ${kind}`;
  if (state === "pending") {
    return (
      <Alert tone="caution" title="Waiting for a moderator" role="status">
        {subject} is in the moderation queue. A member&apos;s first posts are read by a moderator before anyone else sees them;
        until then only {mine ? "you" : "its author"} and the moderators can read it.
      </Alert>
    );
  }
  if (state === "hidden") {
    return (
      <Alert tone="caution" title="Hidden pending review" role="status">
        {subject} was flagged by several members and is hidden until a moderator reviews it.
      </Alert>
    );
  }
  return (
    <Alert tone="stop" title="Removed by a moderator" role="status">
      {subject} is no longer shown in the Q&amp;A.{removalReason ? ` Reason given: ${removalReason}` : ""}
    </Alert>
  );
}
