import type { PostState } from "@/db/schema/qa";

// Votes and the accepted answer, as pure rules; lib/qa/votes.ts applies them under a row lock.

export type Refusal = { ok: false; status: 403 | 409; message: string };

/** Any member votes on a visible answer to a visible question, except on their own. */
export function planVote({ answer, question, voterId }: { answer: { state: PostState; authorId: string }; question: { state: PostState }; voterId: string }): { ok: true } | Refusal {
  if (answer.authorId === voterId) return { ok: false, status: 403, message: "You cannot vote on your own answer." };
  if (answer.state !== "visible" || question.state !== "visible") return { ok: false, status: 409, message: "Only visible answers can be voted on." };
  return { ok: true };
}

/** Only the asker picks the accepted answer: a visible answer to their own visible question (or none). */
export function planAccept({
  question,
  answer,
  actorId,
}: {
  question: { state: PostState; authorId: string };
  /** undefined when the asker takes the acceptance back */
  answer?: { state: PostState; questionMatches: boolean };
  actorId: string;
}): { ok: true } | Refusal {
  if (question.authorId !== actorId) return { ok: false, status: 403, message: "Only the person who asked can accept an answer." };
  if (question.state !== "visible") return { ok: false, status: 409, message: "Answers can be accepted once the question is visible." };
  if (answer && !answer.questionMatches) return { ok: false, status: 409, message: "That answer belongs to another question." };
  if (answer && answer.state !== "visible") return { ok: false, status: 409, message: "Only a visible answer can be accepted." };
  return { ok: true };
}
