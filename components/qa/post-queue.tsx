"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import type { PostQueue, QueuePost } from "@/db/queries/qa";
import { Markdown } from "@/components/markdown";
import { RelativeTime } from "@/components/moderation/relative-time";
import { EmptyState } from "@/components/ui/empty-state";
import { ErrorState } from "@/components/ui/error-state";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { HIDE_AT_OPEN_FLAGS } from "@/lib/qa/rules";
import { POST_STATE_LABELS } from "./labels";
import { OneClickPostForm, POST_QUEUE_QUERY_KEY, RemovePostForm, type BoundPostAction } from "./post-moderation-forms";

const REFRESH_MS = 15_000;

type ActionFor = (kind: string, id: string, previous: Parameters<BoundPostAction>[0], formData: FormData) => ReturnType<BoundPostAction>;

export type PostQueueActions = { approve: ActionFor; remove: ActionFor; restore: ActionFor };

async function fetchQueue(): Promise<PostQueue> {
  const res = await fetch("/api/posts/queue", { cache: "no-store" });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { message?: string } | null)?.message ?? `The queue answered ${res.status}.`);
  return (await res.json()) as PostQueue;
}

function QueueItem({ post, imageOrigins, actions }: { post: QueuePost; imageOrigins: readonly string[]; actions: PostQueueActions }) {
  const state = POST_STATE_LABELS[post.state];
  const link = post.kind === "question" ? `/questions/${post.id}` : `/questions/${post.questionId}#answer-${post.id}`;
  const bind = (action: ActionFor): BoundPostAction => action.bind(null, post.kind, post.id);
  return (
    <li className="space-y-3 rounded-md border border-graphite-200 bg-paper-raised p-4" data-testid={`queue-post-${post.id}`}>
      <div className="flex flex-wrap items-center gap-2">
        <StateBadge label={post.kind === "question" ? "Question" : "Answer"} />
        <StateBadge label={state.label} tone={state.tone} />
        {post.openFlags > 0 ? <StateBadge label={`${post.openFlags} open flag${post.openFlags === 1 ? "" : "s"}`} tone="caution" /> : null}
      </div>
      <p className="font-semibold">
        {post.kind === "answer" ? "Answer to " : null}
        <Link href={link}>{post.questionTitle}</Link>
      </p>
      <p className="text-sm text-graphite-600">
        By {post.authorName}
        {post.authorEmail ? <span className="font-mono text-xs"> ({post.authorEmail})</span> : null} · <RelativeTime iso={post.createdAt} />
      </p>
      <div className="max-h-80 overflow-y-auto rounded border border-graphite-100 bg-paper p-3">
        <Markdown imageOrigins={imageOrigins} minHeadingLevel={4}>
          {post.bodyMd}
        </Markdown>
        {post.photos.length > 0 ? (
          <ul className="mt-3 flex flex-wrap gap-2" aria-label="Photos">
            {post.photos.map((photo) => (
              <li key={photo.key}>
                <a href={photo.url}>
                  {/* eslint-disable-next-line @next/next/no-img-element -- served by the upload provider */}
                  <img src={photo.thumbUrl} alt={`Photo ${photo.position + 1} of the post`} className="h-20 w-28 rounded-sm border border-graphite-200 object-cover" />
                </a>
              </li>
            ))}
          </ul>
        ) : null}
      </div>
      {post.flags.length > 0 ? (
        <div>
          <p className="text-sm font-semibold">Flags</p>
          <ul className="list-disc space-y-1 pl-6 text-sm" data-testid="queue-flags">
            {post.flags.map((flag, i) => (
              <li key={i}>
                “{flag.reason}” — {flag.flaggerName}, <RelativeTime iso={flag.createdAt} showIso={false} />
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div className="grid gap-4 border-t border-graphite-100 pt-3 md:grid-cols-[auto_1fr]">
        <div>
          {post.state === "pending" ? <OneClickPostForm action={bind(actions.approve)} label={`Approve the ${post.kind}`} pendingLabel="Approving…" /> : null}
          {post.state === "hidden" || (post.state === "visible" && post.openFlags > 0) ? (
            <OneClickPostForm
              action={bind(actions.restore)}
              label={post.state === "hidden" ? `Restore the ${post.kind}` : "Keep it: dismiss the flags"}
              pendingLabel="Restoring…"
              variant="secondary"
            />
          ) : null}
        </div>
        <RemovePostForm action={bind(actions.remove)} kind={post.kind} />
      </div>
    </li>
  );
}

function Section({ title, posts, empty, imageOrigins, actions, testId }: { title: string; posts: QueuePost[]; empty: string; imageOrigins: readonly string[]; actions: PostQueueActions; testId: string }) {
  return (
    <Panel title={`${title} (${posts.length})`}>
      {posts.length === 0 ? (
        <EmptyState title="Nothing here">{empty}</EmptyState>
      ) : (
        <ol className="space-y-4" data-testid={testId}>
          {posts.map((post) => (
            <QueueItem key={`${post.kind}-${post.id}`} post={post} imageOrigins={imageOrigins} actions={actions} />
          ))}
        </ol>
      )}
    </Panel>
  );
}

/** The Q&A moderation queue; refreshes itself every 15 s and after each decision. */
export function PostQueueView({ initial, imageOrigins, actions }: { initial: PostQueue; imageOrigins: readonly string[]; actions: PostQueueActions }) {
  const queue = useQuery({
    queryKey: POST_QUEUE_QUERY_KEY,
    queryFn: fetchQueue,
    initialData: initial,
    initialDataUpdatedAt: () => Date.now(),
    staleTime: REFRESH_MS,
    refetchInterval: REFRESH_MS,
  });
  if (queue.isError && queue.data === undefined) return <ErrorState title="The queue could not be loaded">{queue.error.message}</ErrorState>;
  const data = queue.data ?? { pending: [], flagged: [] };
  return (
    <div className="space-y-6">
      <p className="text-sm text-graphite-600" aria-live="polite" data-testid="post-queue-status">
        {data.pending.length} waiting for a first approval, {data.flagged.length} flagged or hidden. The lists refresh every 15 seconds
        {queue.isFetching ? " (refreshing…)" : ""}.{queue.isError ? ` The last refresh failed: ${queue.error.message}` : ""}
      </p>
      <Section
        title="Waiting for a first approval"
        posts={data.pending}
        empty="New members' first posts appear here before anyone else can read them."
        imageOrigins={imageOrigins}
        actions={actions}
        testId="pending-posts"
      />
      <Section
        title="Flagged and hidden"
        posts={data.flagged}
        empty={`Posts members flag appear here; ${HIDE_AT_OPEN_FLAGS} open flags hide a post until you decide.`}
        imageOrigins={imageOrigins}
        actions={actions}
        testId="flagged-posts"
      />
    </div>
  );
}
