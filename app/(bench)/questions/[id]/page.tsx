import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AnswerCard } from "@/components/qa/answer-card";
import { AnswerForm } from "@/components/qa/answer-form";
import { FlagForm } from "@/components/qa/flag-form";
import { answerCountLabel, formatPostDate } from "@/components/qa/labels";
import { LinkedLog } from "@/components/qa/linked-log";
import { PostBody } from "@/components/qa/post-body";
import { PostStateNote } from "@/components/qa/post-state-note";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getLogForViewer } from "@/db/queries/bench";
import { answersForViewer, getQuestionForViewer } from "@/db/queries/qa";
import { getSessionUser } from "@/lib/auth/guard";
import { orderAnswers } from "@/lib/qa/rules";
import { uploadImageOrigins } from "@/lib/uploads/origin";
import { acceptAction, answerAction, flagAction, voteAction } from "./actions";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ posted?: string; answered?: string; flagged?: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const question = await getQuestionForViewer(await getSessionUser(), (await params).id);
  return { title: question?.title ?? "Question not found" };
}

export default async function QuestionPage({ params, searchParams }: Props) {
  const [{ id }, query, viewer] = await Promise.all([params, searchParams, getSessionUser()]);
  const question = await getQuestionForViewer(viewer, id);
  if (!question) notFound();
  const [unordered, log] = await Promise.all([answersForViewer(viewer, question), question.logId ? getLogForViewer(viewer, question.logId) : null]);
  const answers = orderAnswers(unordered, question.acceptedAnswerId);
  const imageOrigins = uploadImageOrigins();
  const mine = viewer?.id === question.authorId;
  const open = question.state === "visible";
  const visibleAnswers = answers.filter((a) => a.state === "visible").length;

  return (
    <article className="space-y-8" data-testid="question-page" data-state={question.state}>
      <PageHeader
        eyebrow={
          question.listing ? (
            <>
              Question about{" "}
              {question.listing.public ? <Link href={`/listings/${question.listing.slug}`}>{question.listing.title}</Link> : question.listing.title}
            </>
          ) : (
            "Question for the general bench"
          )
        }
        title={question.title}
        lede={
          <>
            {mine ? "You asked" : `Asked by ${question.authorName}`} ·{" "}
            <time dateTime={question.createdAt.toISOString()}>{formatPostDate(question.createdAt)}</time>
          </>
        }
        actions={
          <ButtonLink href="/questions" variant="secondary" size="sm">
            All questions
          </ButtonLink>
        }
      />

      {query.posted === "visible" && mine ? <Alert tone="info" title="Your question is up">Members can read and answer it now.</Alert> : null}
      {query.flagged === "open" || query.flagged === "hidden" ? (
        <Alert tone="info" title="Thank you for flagging" role="status">
          {query.flagged === "hidden"
            ? "Enough members have flagged that answer that it is now hidden until a moderator reviews it."
            : "A moderator will look at the post you flagged."}
        </Alert>
      ) : null}
      {query.answered === "pending" ? (
        <Alert tone="caution" title="Your answer waits for a moderator" role="status">
          A member&apos;s first posts are read by a moderator before they are shown. You will see it below, marked as waiting.
        </Alert>
      ) : null}
      <div data-testid="question-state-note">
        <PostStateNote kind="question" state={question.state} removalReason={question.removalReason} mine={mine} />
      </div>

      <section aria-label="The question" className="space-y-4" data-testid="question-body">
        <PostBody bodyMd={question.bodyMd} photos={question.photos} imageOrigins={imageOrigins} label="the question" />
        <LinkedLog log={log} viewerIsOwner={mine} />
        {viewer && !mine && open ? (
          <FlagForm action={flagAction.bind(null, "question", question.id, question.id)} kind="question" alreadyFlagged={question.flaggedByViewer} />
        ) : null}
        {question.openFlags > 0 ? <p className="text-sm text-amber-700">{question.openFlags} open flag{question.openFlags === 1 ? "" : "s"} — see the moderation queue.</p> : null}
      </section>

      <section aria-labelledby="answers-heading" className="space-y-4">
        <h2 id="answers-heading" className="text-xl font-semibold text-graphite-900">
          {answerCountLabel(visibleAnswers)}
        </h2>
        {answers.length > 0 ? (
          <Alert tone="caution" title="Before you act on an answer" role="none">
            Answers come from other builders, not from the seller or Fluxyard. Unplug the build and check with a meter that the bus
            capacitors are discharged before you touch anything; local electrical codes and licensed practice take precedence.
          </Alert>
        ) : null}
        <div className="space-y-3" data-testid="answers">
          {answers.map((answer) => {
            const answerOpen = open && answer.state === "visible";
            const others = viewer !== null && viewer.id !== answer.authorId;
            return (
              <AnswerCard
                key={answer.id}
                answer={answer}
                viewerId={viewer?.id ?? null}
                imageOrigins={imageOrigins}
                actions={{
                  vote: answerOpen && others ? voteAction.bind(null, answer.id, question.id) : undefined,
                  flag: answerOpen && others ? flagAction.bind(null, "answer", answer.id, question.id) : undefined,
                  accept: answerOpen && mine ? acceptAction.bind(null, question.id, answer.accepted ? null : answer.id) : undefined,
                }}
              />
            );
          })}
        </div>
      </section>

      {!open && question.state === "pending" ? <p className="text-graphite-700">Answers open once a moderator has approved the question.</p> : null}
      {open ? (
        viewer ? (
          <Panel title="Answer this question">
            <AnswerForm action={answerAction.bind(null, question.id)} />
          </Panel>
        ) : (
          <p className="rounded-md border border-dashed border-graphite-300 px-4 py-3 text-graphite-700">
            <Link href={`/sign-in?next=${encodeURIComponent(`/questions/${question.id}`)}`}>Sign in</Link> to answer, vote or flag a post.
          </p>
        )
      ) : null}
    </article>
  );
}
