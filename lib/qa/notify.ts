import "server-only";
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { questions, users } from "@/db/schema";
import { displayName } from "@/db/queries/qa";
import { answerPostedMail } from "@/emails/qa/answer-posted";
import { postRemovedMail } from "@/emails/qa/post-removed";
import { env } from "@/lib/env";
import { enqueueMail } from "@/lib/mail/outbox";
import type { PostKind } from "./rules";

// The Q&A's two e-mails, written to the outbox inside the transaction that causes them.

export const questionUrl = (questionId: string, answerId?: string) =>
  `${env().APP_URL}/questions/${questionId}${answerId ? `#answer-${answerId}` : ""}`;

async function person(tx: Tx, userId: string) {
  const [row] = await tx.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, userId));
  return row ?? null;
}

/**
 * Tells the asker an answer is up. Only once the answer is visible, only while the question is,
 * and not when people answer their own question. Returns the outbox ids to dispatch after commit.
 */
export async function mailAnswerToAsker(tx: Tx, answer: { id: string; questionId: string; authorId: string }): Promise<string[]> {
  const [question] = await tx
    .select({ authorId: questions.authorId, title: questions.title, state: questions.state })
    .from(questions)
    .where(eq(questions.id, answer.questionId));
  if (!question || question.state !== "visible" || question.authorId === answer.authorId) return [];
  const [asker, answerer] = await Promise.all([person(tx, question.authorId), person(tx, answer.authorId)]);
  if (!asker?.email) return [];
  const id = await enqueueMail(tx, {
    template: answerPostedMail,
    to: asker.email,
    props: {
      askerName: displayName(asker.name),
      answererName: displayName(answerer?.name ?? null),
      questionTitle: question.title,
      questionUrl: questionUrl(answer.questionId, answer.id),
    },
  });
  return [id];
}

/** Tells an author their post was removed, with the moderator's reason. */
export async function mailRemovalToAuthor(
  tx: Tx,
  post: { kind: PostKind; id: string; questionId: string; questionTitle: string; authorId: string },
  reason: string,
): Promise<string[]> {
  const author = await person(tx, post.authorId);
  if (!author?.email) return [];
  const id = await enqueueMail(tx, {
    template: postRemovedMail,
    to: author.email,
    props: {
      authorName: displayName(author.name),
      kind: post.kind,
      questionTitle: post.questionTitle,
      reason,
      questionUrl: questionUrl(post.questionId, post.kind === "answer" ? post.id : undefined),
    },
  });
  return [id];
}
