import type { AnswerView } from "@/db/queries/qa";
import { StateBadge } from "@/components/ui/state-badge";
import type { FormResult } from "@/lib/validations/auth";
import { AcceptButton } from "./accept-button";
import { FlagForm } from "./flag-form";
import type { QaFormAction } from "./form-helpers";
import { formatPostDate } from "./labels";
import { PostBody } from "./post-body";
import { PostStateNote } from "./post-state-note";
import { ScoreOnly, VoteControls } from "./vote-controls";

export type AnswerCardActions = {
  vote?: QaFormAction;
  flag?: QaFormAction;
  accept?: (previous: FormResult | null) => Promise<FormResult>;
};

/** One answer: score and votes beside it, the accepted mark, the text and photos, and what the viewer may do. */
export function AnswerCard({
  answer,
  viewerId,
  imageOrigins,
  actions,
}: {
  answer: AnswerView;
  viewerId: string | null;
  imageOrigins: readonly string[];
  actions: AnswerCardActions;
}) {
  const mine = viewerId === answer.authorId;
  const scoreNote = viewerId === null ? "sign in to vote" : mine ? "your answer" : "score";
  return (
    <article
      id={`answer-${answer.id}`}
      className="flex scroll-mt-4 gap-4 rounded-md border border-graphite-200 bg-paper-raised p-4 data-[accepted=true]:border-verdigris-600"
      data-accepted={answer.accepted}
      data-state={answer.state}
      data-testid="answer"
      aria-label={`Answer by ${mine ? "you" : answer.authorName}`}
    >
      <div className="w-14 shrink-0">
        {actions.vote ? <VoteControls action={actions.vote} score={answer.score} vote={answer.viewerVote} /> : <ScoreOnly score={answer.score} note={scoreNote} />}
      </div>
      <div className="min-w-0 flex-1 space-y-3">
        <div className="flex flex-wrap items-center gap-2 text-sm text-graphite-600">
          {answer.accepted ? <StateBadge label="Accepted answer" tone="clear" /> : null}
          <span>
            {mine ? "You answered" : `${answer.authorName} answered`} · <time dateTime={answer.createdAt.toISOString()}>{formatPostDate(answer.createdAt)}</time>
          </span>
        </div>
        <PostStateNote kind="answer" state={answer.state} removalReason={answer.removalReason} mine={mine} />
        <PostBody bodyMd={answer.bodyMd} photos={answer.photos} imageOrigins={imageOrigins} label={`the answer by ${answer.authorName}`} />
        <div className="flex flex-wrap items-start justify-between gap-3 border-t border-graphite-100 pt-2">
          {actions.flag ? <FlagForm action={actions.flag} kind="answer" alreadyFlagged={answer.flaggedByViewer} /> : <span />}
          {actions.accept ? <AcceptButton action={actions.accept} accepted={answer.accepted} /> : null}
        </div>
      </div>
    </article>
  );
}
