import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, postFlags, questions } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/access";
import { dispatchMail } from "@/lib/mail/outbox";
import { enforceRateLimit } from "@/lib/rate-limit";
import { approvePostSchema, flagPostSchema, removePostSchema, restorePostSchema } from "@/lib/validations/qa";
import { flaggingLimit, flaggingRefusal } from "./limits";
import { planFlag, planModeration, type PostAction } from "./moderation-rules";
import { mailAnswerToAsker, mailRemovalToAuthor } from "./notify";
import { invalid, QaError, runQa, type QaOutcome } from "./outcome";
import { countOpenFlags, isPostKind, lockPost, setPostState } from "./post-rows";
import { canSeePost, shouldHide } from "./rules";
import { revalidatePostListingPage } from "@/lib/listings/listing-pages";

// The moderator's three decisions on a post and the members' flags. Each runs in one transaction
// with the post's row locked: the state change, the flags it resolves, the audit entry and the
// e-mail it causes commit together or not at all.

const SCHEMAS = { approve: approvePostSchema, remove: removePostSchema, restore: restorePostSchema } as const;

export type Moderated = { kind: string; id: string; questionId: string; from: string; to: string; flagsResolved: number };

export async function moderatePost(user: SessionUser, kind: string, id: string, action: PostAction, body: unknown): Promise<QaOutcome<Moderated>> {
  let mailIds: string[] = [];
  const outcome = await runQa(async () => {
    if (!isPostKind(kind)) throw new QaError(404, "No such post.");
    const parsed = SCHEMAS[action].safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    const reason = "reason" in parsed.data ? (parsed.data.reason as string) : undefined;
    return db.transaction(async (tx) => {
      const post = await lockPost(tx, kind, id);
      if (!post) throw new QaError(404, "No such post.");
      const openFlags = await countOpenFlags(tx, kind, id);
      const plan = planModeration({ post: { kind, state: post.state, authorId: post.authorId, openFlags }, action, actor: user, reason });
      if (!plan.ok) throw new QaError(plan.status, plan.message);

      await setPostState(tx, kind, id, plan.to, plan.to === "removed" ? reason : undefined);
      const now = new Date();
      const resolved = plan.resolvesFlags
        ? await tx
            .update(postFlags)
            .set({ resolvedAt: now })
            .where(and(eq(postFlags.postKind, kind), eq(postFlags.postId, id), isNull(postFlags.resolvedAt)))
            .returning({ id: postFlags.id })
        : [];
      // A removed answer cannot stay the accepted one.
      if (kind === "answer" && plan.to === "removed") {
        await tx.update(questions).set({ acceptedAnswerId: null }).where(and(eq(questions.id, post.questionId), eq(questions.acceptedAnswerId, id)));
      }
      await tx.insert(auditLog).values({
        actorId: user.id,
        action: plan.audit,
        subjectType: kind,
        subjectId: id,
        reason: reason ?? null,
        details: { from: plan.from, to: plan.to, flagsResolved: resolved.length, questionId: post.questionId },
      });
      if (action === "approve" && kind === "answer") {
        mailIds = await mailAnswerToAsker(tx, { id, questionId: post.questionId, authorId: post.authorId });
      }
      if (action === "remove" && reason) mailIds = await mailRemovalToAuthor(tx, { ...post, kind }, reason);
      return { kind, id, questionId: post.questionId, from: plan.from, to: plan.to, flagsResolved: resolved.length };
    });
  });
  if (outcome.ok) await dispatchMail(mailIds);
  // The listing's Q&A panel lists its visible questions with their visible answers.
  if (outcome.ok) await revalidatePostListingPage("question", outcome.questionId);
  return outcome;
}

export type Flagged = { openFlags: number; hidden: boolean };

/**
 * A member flags a visible post once, with a reason. The flag that reaches HIDE_AT_OPEN_FLAGS hides
 * the post in the same transaction, recorded in the audit log as the platform's own action.
 */
export async function flagPost(user: SessionUser, kind: string, id: string, body: unknown): Promise<QaOutcome<Flagged>> {
  const outcome = await runQa(async () => {
    if (!isPostKind(kind)) throw new QaError(404, "No such post.");
    const parsed = flagPostSchema.safeParse(body ?? {});
    if (!parsed.success) throw invalid(parsed.error);
    return db.transaction(async (tx) => {
      const post = await lockPost(tx, kind, id);
      if (!post || !canSeePost(post, user) || !canSeePost({ state: post.questionState, authorId: post.questionAuthorId }, user)) {
        throw new QaError(404, "No such post.");
      }
      const plan = planFlag({ post: { kind, state: post.state, authorId: post.authorId }, flaggerId: user.id });
      if (!plan.ok) throw new QaError(plan.status, plan.message);
      const [flag] = await tx
        .insert(postFlags)
        .values({ postKind: kind, postId: id, flaggerId: user.id, reason: parsed.data.reason })
        .onConflictDoNothing()
        .returning({ id: postFlags.id });
      if (!flag) throw new QaError(409, `You have already flagged this ${kind}; a moderator will look at it.`);
      // Counted only once the flag is known to be new, so a repeated flag does not use up the budget.
      await enforceRateLimit(flaggingLimit(user.id), flaggingRefusal, { executor: tx });
      const openFlags = await countOpenFlags(tx, kind, id);
      const hidden = shouldHide({ state: post.state, openFlags });
      if (hidden) {
        await setPostState(tx, kind, id, "hidden");
        await tx.insert(auditLog).values({
          actorId: null,
          action: `${kind}.hidden`,
          subjectType: kind,
          subjectId: id,
          reason: `${openFlags} open flags`,
          details: { from: post.state, to: "hidden", openFlags, lastFlagBy: user.id, questionId: post.questionId },
        });
      }
      return { openFlags, hidden };
    });
  });
  if (outcome.ok && outcome.hidden) await revalidatePostListingPage(kind, id);
  return outcome;
}
