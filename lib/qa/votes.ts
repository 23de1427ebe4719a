import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { answers, answerVotes, questions } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/access";
import { isUuid } from "@/lib/moderation/ids";
import { acceptAnswerSchema, voteSchema } from "@/lib/validations/qa";
import { planAccept, planVote } from "./answer-rules";
import { invalid, QaError, runQa, type QaOutcome } from "./outcome";
import { lockPost } from "./post-rows";
import { canSeePost } from "./rules";

export type Voted = { score: number; vote: -1 | 0 | 1 };

/**
 * One vote per member per answer: +1, -1, or 0 to take it back; voting the same way twice changes
 * nothing. The answer's row is locked first, so concurrent votes take turns and the stored score is
 * always the sum of the votes, recounted in the same transaction.
 */
export async function voteOnAnswer(user: SessionUser, answerId: string, body: unknown): Promise<QaOutcome<Voted>> {
  return runQa(async () => {
    const parsed = voteSchema.safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    const value = parsed.data.value;
    return db.transaction(async (tx) => {
      const post = await lockPost(tx, "answer", answerId);
      if (!post || !canSeePost(post, user) || !canSeePost({ state: post.questionState, authorId: post.questionAuthorId }, user)) {
        throw new QaError(404, "No such answer.");
      }
      const plan = planVote({ answer: post, question: { state: post.questionState }, voterId: user.id });
      if (!plan.ok) throw new QaError(plan.status, plan.message);
      if (value === 0) {
        await tx.delete(answerVotes).where(and(eq(answerVotes.answerId, answerId), eq(answerVotes.voterId, user.id)));
      } else {
        await tx
          .insert(answerVotes)
          .values({ answerId, voterId: user.id, value })
          .onConflictDoUpdate({ target: [answerVotes.answerId, answerVotes.voterId], set: { value } });
      }
      const [row] = await tx
        .update(answers)
        .set({ score: sql`(select coalesce(sum(${answerVotes.value}), 0)::int from ${answerVotes} where ${answerVotes.answerId} = ${answerId})` })
        .where(eq(answers.id, answerId))
        .returning({ score: answers.score });
      return { score: row?.score ?? 0, vote: value };
    });
  });
}

export type Accepted = { acceptedAnswerId: string | null };

/** The asker marks one answer as accepted (replacing any earlier one), or none with `answerId: null`. */
export async function acceptAnswer(user: SessionUser, questionId: string, body: unknown): Promise<QaOutcome<Accepted>> {
  return runQa(async () => {
    const parsed = acceptAnswerSchema.safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    const answerId = parsed.data.answerId;
    return db.transaction(async (tx) => {
      const question = isUuid(questionId) ? await lockPost(tx, "question", questionId) : null;
      if (!question || !canSeePost(question, user)) throw new QaError(404, "No such question.");
      let answer: { state: (typeof question)["state"]; questionMatches: boolean } | undefined;
      if (answerId) {
        const [row] = await tx.select({ state: answers.state, questionId: answers.questionId }).from(answers).where(eq(answers.id, answerId));
        if (!row) throw new QaError(404, "No such answer.");
        answer = { state: row.state, questionMatches: row.questionId === questionId };
      }
      const plan = planAccept({ question, answer, actorId: user.id });
      if (!plan.ok) throw new QaError(plan.status, plan.message);
      await tx.update(questions).set({ acceptedAnswerId: answerId, updatedAt: new Date() }).where(eq(questions.id, questionId));
      return { acceptedAnswerId: answerId };
    });
  });
}
