import "server-only";
import { and, asc, count, desc, eq, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type Executor } from "@/db/client";
import { answers, answerVotes, bringUpLogs, listings, postFlags, postPhotos, questions, uploads, users, type ListingState, type PostState, type Role } from "@/db/schema";
import { isModerator, type PostKind } from "@/lib/qa/rules";

// Reads of the Q&A. Every read takes the viewer and applies the visibility rule of lib/qa/rules.ts:
// visible posts for everyone; pending, hidden and removed ones only for their author and moderators.

export type QaViewer = { id: string; roles: readonly Role[] } | null;

/** Listings are public in these states; a question keeps its link to its listing only while it is. */
const PUBLIC_LISTING_STATES: ListingState[] = ["live", "held", "retired"];

export type ListingRef = { id: string; slug: string; title: string; public: boolean };

function listingRef(row: { listingId: string | null; listingSlug: string | null; listingTitle: string | null; listingState: ListingState | null }): ListingRef | null {
  if (!row.listingId || !row.listingSlug || !row.listingTitle || !row.listingState) return null;
  return { id: row.listingId, slug: row.listingSlug, title: row.listingTitle, public: PUBLIC_LISTING_STATES.includes(row.listingState) };
}

/** A member's name as other people see it; their e-mail address is never shown in the Q&A. */
export const displayName = (name: string | null) => (name && name.trim() !== "" ? name : "A member");

// ——— Posts counted for pre-moderation ———

/** Posts of a member that a moderator let through (or that needed no moderation) and that are still up. */
export async function countApprovedPosts(userId: string, executor: Executor = db): Promise<number> {
  const result = await executor.execute<{ n: number }>(sql`
    select (select count(*) from ${questions} where ${questions.authorId} = ${userId} and ${questions.state} = 'visible')
         + (select count(*) from ${answers} where ${answers.authorId} = ${userId} and ${answers.state} = 'visible') as n
  `);
  return Number(result.rows[0]?.n ?? 0);
}

// ——— Photos ———

export type PostPhotoView = { key: string; url: string; thumbUrl: string; width: number | null; height: number | null; position: number };

export async function photosOf(kind: PostKind, postIds: readonly string[], executor: Executor = db): Promise<Map<string, PostPhotoView[]>> {
  const byPost = new Map<string, PostPhotoView[]>();
  if (postIds.length === 0) return byPost;
  const rows = await executor
    .select({ postId: postPhotos.postId, key: uploads.key, url: uploads.url, thumbUrl: uploads.thumbUrl, width: uploads.width, height: uploads.height, position: postPhotos.position })
    .from(postPhotos)
    .innerJoin(uploads, eq(uploads.key, postPhotos.uploadKey))
    .where(and(eq(postPhotos.postKind, kind), inArray(postPhotos.postId, [...postIds])))
    .orderBy(asc(postPhotos.position));
  for (const { postId, thumbUrl, ...photo } of rows) {
    const list = byPost.get(postId) ?? [];
    list.push({ ...photo, thumbUrl: thumbUrl ?? photo.url });
    byPost.set(postId, list);
  }
  return byPost;
}

// ——— The question list ———

export type QuestionListRow = {
  id: string;
  title: string;
  state: PostState;
  createdAt: Date;
  authorName: string;
  mine: boolean;
  listing: ListingRef | null;
  answerCount: number;
  answered: boolean;
};

export type QuestionListFilter = { listingId?: string; unanswered?: boolean; page?: number; pageSize?: number };

const visibleAnswerCount = sql<number>`(select count(*)::int from ${answers} where ${answers.questionId} = ${questions.id} and ${answers.state} = 'visible')`;

/** Visible questions, newest first, plus the viewer's own ones still waiting or hidden (marked as theirs). */
export async function listQuestions(viewer: QaViewer, filter: QuestionListFilter = {}): Promise<{ rows: QuestionListRow[]; hasMore: boolean }> {
  const pageSize = filter.pageSize ?? 20;
  const page = Math.max(1, filter.page ?? 1);
  const seen: SQL = viewer
    ? or(eq(questions.state, "visible"), and(eq(questions.authorId, viewer.id), inArray(questions.state, ["pending", "hidden"])))!
    : eq(questions.state, "visible");
  const rows = await db
    .select({
      id: questions.id,
      title: questions.title,
      state: questions.state,
      createdAt: questions.createdAt,
      authorId: questions.authorId,
      authorName: users.name,
      listingId: listings.id,
      listingSlug: listings.slug,
      listingTitle: listings.title,
      listingState: listings.state,
      answerCount: visibleAnswerCount,
    })
    .from(questions)
    .innerJoin(users, eq(users.id, questions.authorId))
    .leftJoin(listings, eq(listings.id, questions.listingId))
    .where(
      and(
        seen,
        filter.listingId ? eq(questions.listingId, filter.listingId) : undefined,
        filter.unanswered ? sql`${visibleAnswerCount} = 0` : undefined,
      ),
    )
    .orderBy(desc(questions.createdAt), desc(questions.id))
    .limit(pageSize + 1)
    .offset((page - 1) * pageSize);
  return {
    hasMore: rows.length > pageSize,
    rows: rows.slice(0, pageSize).map((r) => ({
      id: r.id,
      title: r.title,
      state: r.state,
      createdAt: r.createdAt,
      authorName: displayName(r.authorName),
      mine: viewer?.id === r.authorId,
      listing: listingRef(r),
      answerCount: Number(r.answerCount),
      answered: Number(r.answerCount) > 0,
    })),
  };
}

/** The newest visible questions about a listing and how many there are, for its page. */
export async function questionsForListing(listingId: string, limit = 5): Promise<{ rows: QuestionListRow[]; total: number }> {
  const [{ rows }, [total]] = await Promise.all([
    listQuestions(null, { listingId, pageSize: limit }),
    db.select({ n: count() }).from(questions).where(and(eq(questions.listingId, listingId), eq(questions.state, "visible"))),
  ]);
  return { rows, total: total?.n ?? 0 };
}

// ——— One question with its answers ———

export type QuestionView = {
  id: string;
  title: string;
  bodyMd: string;
  state: PostState;
  removalReason: string | null;
  createdAt: Date;
  authorId: string;
  authorName: string;
  listing: ListingRef | null;
  logId: string | null;
  acceptedAnswerId: string | null;
  photos: PostPhotoView[];
  /** whether the viewer has flagged it (each member flags a post once) */
  flaggedByViewer: boolean;
  /** open flags; only counted for moderators */
  openFlags: number;
};

export type AnswerView = {
  id: string;
  bodyMd: string;
  state: PostState;
  removalReason: string | null;
  createdAt: Date;
  authorId: string;
  authorName: string;
  score: number;
  accepted: boolean;
  photos: PostPhotoView[];
  viewerVote: -1 | 0 | 1;
  flaggedByViewer: boolean;
};

async function flaggedBy(viewer: QaViewer, kind: PostKind, ids: readonly string[]): Promise<Set<string>> {
  if (!viewer || ids.length === 0) return new Set();
  const rows = await db
    .select({ postId: postFlags.postId })
    .from(postFlags)
    .where(and(eq(postFlags.postKind, kind), eq(postFlags.flaggerId, viewer.id), inArray(postFlags.postId, [...ids])));
  return new Set(rows.map((r) => r.postId));
}

async function openFlagCount(kind: PostKind, postId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(postFlags)
    .where(and(eq(postFlags.postKind, kind), eq(postFlags.postId, postId), isNull(postFlags.resolvedAt)));
  return row?.n ?? 0;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The question as this viewer may see it, or null (no such question, or not theirs to see). */
export async function getQuestionForViewer(viewer: QaViewer, questionId: string): Promise<QuestionView | null> {
  if (!UUID.test(questionId)) return null;
  const [row] = await db
    .select({
      id: questions.id,
      title: questions.title,
      bodyMd: questions.bodyMd,
      state: questions.state,
      removalReason: questions.removalReason,
      createdAt: questions.createdAt,
      authorId: questions.authorId,
      authorName: users.name,
      logId: questions.logId,
      acceptedAnswerId: questions.acceptedAnswerId,
      listingId: listings.id,
      listingSlug: listings.slug,
      listingTitle: listings.title,
      listingState: listings.state,
    })
    .from(questions)
    .innerJoin(users, eq(users.id, questions.authorId))
    .leftJoin(listings, eq(listings.id, questions.listingId))
    .where(eq(questions.id, questionId));
  if (!row) return null;
  const moderator = isModerator(viewer);
  if (row.state !== "visible" && !(viewer && (viewer.id === row.authorId || moderator))) return null;
  const [photos, flagged, openFlags] = await Promise.all([
    photosOf("question", [row.id]),
    flaggedBy(viewer, "question", [row.id]),
    moderator ? openFlagCount("question", row.id) : Promise.resolve(0),
  ]);
  return {
    id: row.id,
    title: row.title,
    bodyMd: row.bodyMd,
    state: row.state,
    removalReason: row.removalReason,
    createdAt: row.createdAt,
    authorId: row.authorId,
    authorName: displayName(row.authorName),
    listing: listingRef(row),
    logId: row.logId,
    acceptedAnswerId: row.acceptedAnswerId,
    photos: photos.get(row.id) ?? [],
    flaggedByViewer: flagged.has(row.id),
    openFlags,
  };
}

/**
 * The answers this viewer may see: visible ones, their own in any state, and for moderators
 * also those waiting or hidden. Unordered; lib/qa/rules.ts orderAnswers sorts them.
 */
export async function answersForViewer(viewer: QaViewer, question: { id: string; acceptedAnswerId: string | null }): Promise<AnswerView[]> {
  const moderator = isModerator(viewer);
  const seen: SQL = viewer
    ? or(
        eq(answers.state, "visible"),
        eq(answers.authorId, viewer.id),
        moderator ? inArray(answers.state, ["pending", "hidden"]) : undefined,
      )!
    : eq(answers.state, "visible");
  const rows = await db
    .select({
      id: answers.id,
      bodyMd: answers.bodyMd,
      state: answers.state,
      removalReason: answers.removalReason,
      createdAt: answers.createdAt,
      authorId: answers.authorId,
      authorName: users.name,
      score: answers.score,
    })
    .from(answers)
    .innerJoin(users, eq(users.id, answers.authorId))
    .where(and(eq(answers.questionId, question.id), seen));
  const ids = rows.map((r) => r.id);
  const [photos, flagged, votes] = await Promise.all([
    photosOf("answer", ids),
    flaggedBy(viewer, "answer", ids),
    viewer && ids.length > 0
      ? db.select({ answerId: answerVotes.answerId, value: answerVotes.value }).from(answerVotes).where(and(eq(answerVotes.voterId, viewer.id), inArray(answerVotes.answerId, ids)))
      : Promise.resolve([]),
  ]);
  const voteOf = new Map(votes.map((v) => [v.answerId, v.value as -1 | 1]));
  return rows.map((r) => ({
    ...r,
    authorName: displayName(r.authorName),
    accepted: r.id === question.acceptedAnswerId && r.state === "visible",
    // Only the author and moderators read why a post was removed.
    removalReason: viewer && (viewer.id === r.authorId || moderator) ? r.removalReason : null,
    photos: photos.get(r.id) ?? [],
    viewerVote: voteOf.get(r.id) ?? 0,
    flaggedByViewer: flagged.has(r.id),
  }));
}

// ——— The moderator's queue ———

export type QueueFlag = { reason: string; createdAt: string; flaggerName: string };

export type QueuePost = {
  kind: PostKind;
  id: string;
  questionId: string;
  questionTitle: string;
  bodyMd: string;
  state: PostState;
  createdAt: string;
  authorName: string;
  authorEmail: string | null;
  openFlags: number;
  flags: QueueFlag[];
  photos: PostPhotoView[];
};

export type PostQueue = { pending: QueuePost[]; flagged: QueuePost[] };

type PostRow = {
  kind: PostKind;
  id: string;
  questionId: string;
  questionTitle: string;
  bodyMd: string;
  state: PostState;
  createdAt: Date;
  authorName: string | null;
  authorEmail: string | null;
};

async function queueRows(where: { question: SQL; answer: SQL }): Promise<PostRow[]> {
  const parent = alias(questions, "parent");
  const [qs, as] = await Promise.all([
    db
      .select({ id: questions.id, title: questions.title, bodyMd: questions.bodyMd, state: questions.state, createdAt: questions.createdAt, authorName: users.name, authorEmail: users.email })
      .from(questions)
      .innerJoin(users, eq(users.id, questions.authorId))
      .where(where.question),
    db
      .select({ id: answers.id, questionId: answers.questionId, title: parent.title, bodyMd: answers.bodyMd, state: answers.state, createdAt: answers.createdAt, authorName: users.name, authorEmail: users.email })
      .from(answers)
      .innerJoin(parent, eq(parent.id, answers.questionId))
      .innerJoin(users, eq(users.id, answers.authorId))
      .where(where.answer),
  ]);
  return [
    ...qs.map((q) => ({ kind: "question" as const, id: q.id, questionId: q.id, questionTitle: q.title, bodyMd: q.bodyMd, state: q.state, createdAt: q.createdAt, authorName: q.authorName, authorEmail: q.authorEmail })),
    ...as.map((a) => ({ kind: "answer" as const, id: a.id, questionId: a.questionId, questionTitle: a.title, bodyMd: a.bodyMd, state: a.state, createdAt: a.createdAt, authorName: a.authorName, authorEmail: a.authorEmail })),
  ];
}

const openFlagsOn = (kind: PostKind, id: SQL | typeof questions.id | typeof answers.id) =>
  sql`exists (select 1 from ${postFlags} where ${postFlags.postKind} = ${kind} and ${postFlags.postId} = ${id} and ${postFlags.resolvedAt} is null)`;

/**
 * What moderators work through: posts waiting in pre-moderation (oldest first), and posts that are
 * hidden or carry open flags (hidden first, then the most flags).
 */
export async function postQueue(): Promise<PostQueue> {
  const [pendingRows, flaggedRows] = await Promise.all([
    queueRows({ question: eq(questions.state, "pending"), answer: eq(answers.state, "pending") }),
    queueRows({
      question: or(eq(questions.state, "hidden"), and(eq(questions.state, "visible"), openFlagsOn("question", questions.id)))!,
      answer: or(eq(answers.state, "hidden"), and(eq(answers.state, "visible"), openFlagsOn("answer", answers.id)))!,
    }),
  ]);
  const all = [...pendingRows, ...flaggedRows];
  const flagRows =
    flaggedRows.length === 0
      ? []
      : await db
          .select({ postKind: postFlags.postKind, postId: postFlags.postId, reason: postFlags.reason, createdAt: postFlags.createdAt, flaggerName: users.name })
          .from(postFlags)
          .innerJoin(users, eq(users.id, postFlags.flaggerId))
          .where(and(isNull(postFlags.resolvedAt), inArray(postFlags.postId, flaggedRows.map((r) => r.id))))
          .orderBy(asc(postFlags.createdAt));
  const [questionPhotos, answerPhotos] = await Promise.all([
    photosOf("question", all.filter((r) => r.kind === "question").map((r) => r.id)),
    photosOf("answer", all.filter((r) => r.kind === "answer").map((r) => r.id)),
  ]);
  const toItem = (r: PostRow): QueuePost => {
    const flags = flagRows
      .filter((f) => f.postKind === r.kind && f.postId === r.id)
      .map((f) => ({ reason: f.reason, createdAt: f.createdAt.toISOString(), flaggerName: displayName(f.flaggerName) }));
    return {
      kind: r.kind,
      id: r.id,
      questionId: r.questionId,
      questionTitle: r.questionTitle,
      bodyMd: r.bodyMd,
      state: r.state,
      createdAt: r.createdAt.toISOString(),
      authorName: displayName(r.authorName),
      authorEmail: r.authorEmail,
      openFlags: flags.length,
      flags,
      photos: (r.kind === "question" ? questionPhotos : answerPhotos).get(r.id) ?? [],
    };
  };
  const pending = pendingRows.map(toItem).sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  const flagged = flaggedRows
    .map(toItem)
    .sort((a, b) => Number(b.state === "hidden") - Number(a.state === "hidden") || b.openFlags - a.openFlags || a.createdAt.localeCompare(b.createdAt));
  return { pending, flagged };
}

// ——— What the ask form offers ———

export type ListingChoice = { id: string; title: string };

/** Live listings a question can be about, by title. */
export async function listingChoices(limit = 500): Promise<ListingChoice[]> {
  return db.select({ id: listings.id, title: listings.title }).from(listings).where(eq(listings.state, "live")).orderBy(asc(listings.title)).limit(limit);
}

/** A listing named by the list's filter, whatever its state (its link only while it is public). */
export async function listingById(listingId: string): Promise<ListingRef | null> {
  const [row] = await db
    .select({ listingId: listings.id, listingSlug: listings.slug, listingTitle: listings.title, listingState: listings.state })
    .from(listings)
    .where(eq(listings.id, listingId));
  return row ? listingRef(row) : null;
}

/** A listing a new question may be attached to: it must be live. */
export async function liveListing(listingId: string, executor: Executor = db): Promise<{ id: string; title: string; slug: string } | null> {
  const [row] = await executor
    .select({ id: listings.id, title: listings.title, slug: listings.slug })
    .from(listings)
    .where(and(eq(listings.id, listingId), eq(listings.state, "live")));
  return row ?? null;
}

export type LogChoice = { id: string; title: string; visibility: "private" | "public" };

/** The member's own bring-up logs, newest work first: the ones a question may link. */
export async function ownLogs(ownerId: string, executor: Executor = db): Promise<LogChoice[]> {
  return executor
    .select({ id: bringUpLogs.id, title: bringUpLogs.title, visibility: bringUpLogs.visibility })
    .from(bringUpLogs)
    .where(eq(bringUpLogs.ownerId, ownerId))
    .orderBy(desc(bringUpLogs.updatedAt));
}

/** Whether the log exists and belongs to the member (a question may only link the asker's own log). */
export async function ownsLog(ownerId: string, logId: string, executor: Executor = db): Promise<boolean> {
  const [row] = await executor
    .select({ id: bringUpLogs.id })
    .from(bringUpLogs)
    .where(and(eq(bringUpLogs.id, logId), eq(bringUpLogs.ownerId, ownerId)));
  return row !== undefined;
}
