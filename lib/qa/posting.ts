import "server-only";
import { eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { answers, postPhotos, questions } from "@/db/schema";
import { countApprovedPosts, liveListing, ownsLog } from "@/db/queries/qa";
import { uploadsOwnedBy } from "@/db/queries/uploads";
import type { SessionUser } from "@/lib/auth/access";
import { isUuid } from "@/lib/moderation/ids";
import { dispatchMail } from "@/lib/mail/outbox";
import { enforceRateLimit } from "@/lib/rate-limit";
import { answerSchema, askQuestionSchema, type PostPhotoRef } from "@/lib/validations/qa";
import { postingLimit, postingRefusal } from "./limits";
import { mailAnswerToAsker } from "./notify";
import { invalid, QaError, runQa, type QaOutcome } from "./outcome";
import { canSeePost, initialPostState, type PostKind } from "./rules";
import { revalidatePostListingPage } from "@/lib/listings/listing-pages";

// Asking and answering. Each post is one transaction: the member's posting budget, the checks on
// what it links (listing, log, photos), whether it waits for a moderator, the post and its photos,
// and — for an answer that is visible at once — the asker's e-mail.

export type Posted = { id: string; questionId: string; state: "pending" | "visible" };

/** Only the poster's own cleaned photos, uploaded through the reading-photo route, may be attached. */
async function attachPhotos(tx: Tx, user: SessionUser, kind: PostKind, postId: string, photos: PostPhotoRef[]): Promise<void> {
  if (photos.length === 0) return;
  const keys = photos.map((p) => p.key);
  const owned = new Set((await uploadsOwnedBy(user.id, keys, { purpose: "reading-photo", executor: tx })).map((u) => u.key));
  if (keys.some((k) => !owned.has(k))) {
    throw new QaError(403, "Only photos you uploaded yourself can be attached to your post.", {
      photos: ["One of these photos is not one you uploaded here. Upload it again."],
    });
  }
  await tx.insert(postPhotos).values(photos.map((p, position) => ({ postKind: kind, postId, uploadKey: p.key, position })));
}

async function newPostState(tx: Tx, user: SessionUser) {
  return initialPostState({ roles: user.roles, approvedPosts: await countApprovedPosts(user.id, tx) });
}

export async function askQuestion(user: SessionUser, body: unknown): Promise<QaOutcome<Posted>> {
  const outcome = await runQa(async () => {
    const parsed = askQuestionSchema.safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    const input = parsed.data;
    return db.transaction(async (tx) => {
      await enforceRateLimit(postingLimit(user.id), postingRefusal, { executor: tx });
      if (input.listingId && !(await liveListing(input.listingId, tx))) {
        throw new QaError(422, "Questions can be asked about listings that are in the catalog.", { listingId: ["That listing is not in the catalog."] });
      }
      if (input.logId && !(await ownsLog(user.id, input.logId, tx))) {
        throw new QaError(422, "A question can link one of your own bring-up logs.", { logId: ["That is not one of your bring-up logs."] });
      }
      const state = await newPostState(tx, user);
      const [row] = await tx
        .insert(questions)
        .values({ authorId: user.id, title: input.title, bodyMd: input.bodyMd, listingId: input.listingId ?? null, logId: input.logId ?? null, state })
        .returning({ id: questions.id });
      if (!row) throw new Error("inserting a question returned no row");
      await attachPhotos(tx, user, "question", row.id, input.photos);
      return { id: row.id, questionId: row.id, state };
    });
  });
  if (outcome.ok && outcome.state === "visible") await revalidatePostListingPage("question", outcome.id);
  return outcome;
}

export async function answerQuestion(user: SessionUser, questionId: string, body: unknown): Promise<QaOutcome<Posted>> {
  let mailIds: string[] = [];
  const outcome = await runQa(async () => {
    const parsed = answerSchema.safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    const input = parsed.data;
    return db.transaction(async (tx) => {
      // A share lock: a moderator cannot hide or remove the question while the answer goes in.
      const [question] = isUuid(questionId)
        ? await tx.select({ id: questions.id, authorId: questions.authorId, state: questions.state }).from(questions).where(eq(questions.id, questionId)).for("share")
        : [];
      if (!question || !canSeePost(question, user)) throw new QaError(404, "No such question.");
      if (question.state !== "visible") {
        throw new QaError(409, question.state === "pending" ? "This question waits for a moderator; answers open once it is approved." : "This question is not open for answers.");
      }
      await enforceRateLimit(postingLimit(user.id), postingRefusal, { executor: tx });
      const state = await newPostState(tx, user);
      const [row] = await tx.insert(answers).values({ questionId, authorId: user.id, bodyMd: input.bodyMd, state }).returning({ id: answers.id });
      if (!row) throw new Error("inserting an answer returned no row");
      await attachPhotos(tx, user, "answer", row.id, input.photos);
      if (state === "visible") mailIds = await mailAnswerToAsker(tx, { id: row.id, questionId, authorId: user.id });
      return { id: row.id, questionId, state };
    });
  });
  if (outcome.ok) await dispatchMail(mailIds);
  // A visible answer shows in the listing's Q&A panel at once (its cached page is refreshed).
  if (outcome.ok && outcome.state === "visible") await revalidatePostListingPage("question", questionId);
  return outcome;
}
