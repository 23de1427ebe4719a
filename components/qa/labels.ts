import type { PostState } from "@/db/schema/qa";
import type { StateTone } from "@/components/ui/state-badge";

// A post's state as a word; colour only backs it up.
export const POST_STATE_LABELS: Record<PostState, { label: string; tone: StateTone }> = {
  pending: { label: "Waiting for a moderator", tone: "caution" },
  visible: { label: "Visible", tone: "clear" },
  hidden: { label: "Hidden pending review", tone: "caution" },
  removed: { label: "Removed", tone: "stop" },
};

const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "UTC", timeZoneName: "short" });

/** Dates in one zone (UTC), so the server's render is what every reader sees. */
export function formatPostDate(date: Date | string): string {
  return dateTime.format(new Date(date));
}

export const answerCountLabel = (n: number) => (n === 0 ? "No answers yet" : n === 1 ? "1 answer" : `${n} answers`);
