import Link from "next/link";

/**
 * The bring-up log a question links, when this viewer may open it (public logs for everyone; the
 * asker's own private log for the asker, with a reminder that readers cannot see it).
 */
export function LinkedLog({ log, viewerIsOwner }: { log: { id: string; title: string; visibility: "private" | "public" } | null; viewerIsOwner: boolean }) {
  if (!log) return null;
  return (
    <p className="text-sm text-graphite-700" data-testid="linked-log">
      Bring-up log: <Link href={`/bench/logs/${log.id}`}>{log.title}</Link>
      {log.visibility === "private"
        ? viewerIsOwner
          ? " — private, so only you can open it. Make it public from the log if you want readers to see your readings."
          : " — private; shown to you as a moderator or reviewer."
        : null}
    </p>
  );
}
