import "server-only";
import { and, count, eq, isNull } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { answers, postFlags, questions, type PostState } from "@/db/schema";
import type { PostKind } from "./rules";

// A question or an answer read the same way, locked for the transaction that changes it:
// moderation, flags and votes on one post take turns.

export type LockedPost = {
  kind: PostKind;
  id: string;
  questionId: string;
  questionTitle: string;
  questionState: PostState;
  questionAuthorId: string;
  authorId: string;
  state: PostState;
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isPostKind(kind: string): kind is PostKind {
  return kind === "question" || kind === "answer";
}

export async function lockPost(tx: Tx, kind: PostKind, id: string): Promise<LockedPost | null> {
  if (!UUID.test(id)) return null;
  if (kind === "question") {
    const [q] = await tx
      .select({ id: questions.id, title: questions.title, authorId: questions.authorId, state: questions.state })
      .from(questions)
      .where(eq(questions.id, id))
      .for("update");
    return q
      ? { kind, id: q.id, questionId: q.id, questionTitle: q.title, questionState: q.state, questionAuthorId: q.authorId, authorId: q.authorId, state: q.state }
      : null;
  }
  const [a] = await tx
    .select({ id: answers.id, questionId: answers.questionId, authorId: answers.authorId, state: answers.state })
    .from(answers)
    .where(eq(answers.id, id))
    .for("update");
  if (!a) return null;
  const [q] = await tx
    .select({ title: questions.title, state: questions.state, authorId: questions.authorId })
    .from(questions)
    .where(eq(questions.id, a.questionId));
  if (!q) return null;
  return {
    kind,
    id: a.id,
    questionId: a.questionId,
    questionTitle: q.title,
    questionState: q.state,
    questionAuthorId: q.authorId,
    authorId: a.authorId,
    state: a.state,
  };
}

export async function countOpenFlags(tx: Tx, kind: PostKind, id: string): Promise<number> {
  const [row] = await tx
    .select({ n: count() })
    .from(postFlags)
    .where(and(eq(postFlags.postKind, kind), eq(postFlags.postId, id), isNull(postFlags.resolvedAt)));
  return row?.n ?? 0;
}

export async function setPostState(tx: Tx, kind: PostKind, id: string, state: PostState, removalReason?: string): Promise<void> {
  const table = kind === "question" ? questions : answers;
  await tx
    .update(table)
    .set({ state, updatedAt: new Date(), ...(removalReason !== undefined ? { removalReason } : {}) })
    .where(eq(table.id, id));
}
