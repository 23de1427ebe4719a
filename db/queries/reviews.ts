import "server-only";
import { and, asc, count, desc, eq, inArray, isNotNull, isNull, lt, lte, or, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type Executor, type Tx } from "@/db/client";
import {
  answers,
  auditLog,
  BRING_UP_STAGES,
  bringUpLogs,
  logCheckpoints,
  platformSettings,
  reviewDisputes,
  reviewerApplications,
  reviewerProfiles,
  reviewReports,
  reviewSessions,
  reviewVerdicts,
  userRoles,
  users,
  type BringUpStage,
  type CheckpointVerdict,
  type ReviewSession,
  type ReviewState,
} from "@/db/schema";
import { hasRole, type SessionUser } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { formatMoney } from "@/lib/format/money";
import type { MailTemplate } from "@/emails/registry";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import { formatWhen } from "@/lib/reviews/format";
import { SETTLE_LABELS, stageList } from "@/lib/reviews/labels";
import { refundParts, reviewerShareDue, reviewSplit } from "@/lib/reviews/money";
import {
  captureHeldPayment,
  refundReviewPayment,
  releaseHeldPayment,
  reverseReviewerShare,
  transferReviewerShare,
  type HeldPayment,
  type ProviderOutcome,
} from "@/lib/reviews/provider";
import {
  DELIVERY_WINDOW_MS,
  deliverBy,
  disputeByFrom,
  planReviewTransition,
  respondByFrom,
  type ReviewAction,
  type ReviewActor,
  type SessionFacts,
} from "@/lib/reviews/transitions";
import type { BookingInput, ReportInput, ReviewerApplicationInput, SettleDisputeInput } from "@/lib/validations/reviews";
import { REVIEW_CURRENCY } from "@/lib/validations/reviews";
import { reviewerApplicationReceivedMail } from "@/emails/reviews/reviewer-application-received";
import { reviewerApprovedMail } from "@/emails/reviews/reviewer-approved";
import { reviewerDeclinedMail } from "@/emails/reviews/reviewer-declined";
import { reviewRequestedMail } from "@/emails/reviews/review-requested";
import { reviewAcceptedMail } from "@/emails/reviews/review-accepted";
import { reviewReleasedMail } from "@/emails/reviews/review-released";
import { reviewDeliveredMail } from "@/emails/reviews/review-delivered";
import { reviewDisputedMail } from "@/emails/reviews/review-disputed";
import { reviewDisputeSettledMail } from "@/emails/reviews/review-dispute-settled";

/** A refusal with the status a route would answer and, where it is about one, the form field. */
export class ReviewError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422 | 503,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = "ReviewError";
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const NO_SESSION = "No such review session.";
const OPEN_STATES: ReviewState[] = ["requested", "accepted"];

function appUrl(path: string): string {
  return `${env().APP_URL}${path}`;
}

function nameOf(person: { name: string | null; email?: string | null } | undefined): string {
  return person?.name ?? "A Fluxyard member";
}

async function person(executor: Executor, userId: string): Promise<{ name: string | null; email: string | null }> {
  const [row] = await executor.select({ name: users.name, email: users.email }).from(users).where(eq(users.id, userId));
  return row ?? { name: null, email: null };
}

// ——— Reviewer applications ———

export type ReviewerApplicationRow = typeof reviewerApplications.$inferSelect;

export async function latestReviewerApplication(userId: string): Promise<ReviewerApplicationRow | null> {
  const [row] = await db.select().from(reviewerApplications).where(eq(reviewerApplications.userId, userId)).orderBy(desc(reviewerApplications.createdAt)).limit(1);
  return row ?? null;
}

export type ReviewerProfileRow = typeof reviewerProfiles.$inferSelect;

export async function getReviewerProfile(userId: string, executor: Executor = db): Promise<ReviewerProfileRow | null> {
  const [row] = await executor.select().from(reviewerProfiles).where(eq(reviewerProfiles.userId, userId));
  return row ?? null;
}

/**
 * A member's application to review. One pending application at a time; the person's row is locked
 * so two quick submissions cannot both pass the check.
 */
export async function createReviewerApplication(userId: string, input: ReviewerApplicationInput): Promise<ReviewerApplicationRow> {
  const { application, mailIds } = await db.transaction(async (tx) => {
    const [member] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, userId)).for("update");
    if (!member) throw new ReviewError(404, "No such person.");
    if (await getReviewerProfile(userId, tx)) throw new ReviewError(409, "You are a reviewer already; change your price and availability on your review desk.");
    const [pending] = await tx
      .select({ id: reviewerApplications.id })
      .from(reviewerApplications)
      .where(and(eq(reviewerApplications.userId, userId), eq(reviewerApplications.status, "pending")));
    if (pending) throw new ReviewError(409, "Your application is with a moderator already; you will hear by e-mail.");
    const [application] = await tx
      .insert(reviewerApplications)
      .values({ userId, expertise: input.expertise, profileMd: input.profileMd, trackRecordMd: input.trackRecordMd, priceMinor: input.priceMinor, currency: REVIEW_CURRENCY })
      .returning();
    if (!application) throw new Error("insert returned no row");
    await tx.insert(auditLog).values({
      actorId: userId,
      action: "reviewer_application.submitted",
      subjectType: "reviewer_application",
      subjectId: application.id,
      details: { expertise: input.expertise, priceMinor: input.priceMinor },
    });
    const mailIds = member.email
      ? [await enqueueMail(tx, { template: reviewerApplicationReceivedMail, to: member.email, props: { applicantName: member.name ?? member.email, statusUrl: appUrl("/reviewers/apply") } })]
      : [];
    return { application, mailIds };
  });
  await dispatchMail(mailIds);
  return application;
}

export type PendingReviewerApplication = ReviewerApplicationRow & {
  applicantName: string | null;
  applicantEmail: string | null;
  /** what the platform itself knows of the applicant, beside what they wrote */
  logs: number;
  answers: number;
};

/** Applications waiting for a decision, the oldest first, with the applicant's activity here. */
export async function pendingReviewerApplications(): Promise<PendingReviewerApplication[]> {
  const rows = await db
    .select({ application: reviewerApplications, applicantName: users.name, applicantEmail: users.email })
    .from(reviewerApplications)
    .innerJoin(users, eq(users.id, reviewerApplications.userId))
    .where(eq(reviewerApplications.status, "pending"))
    .orderBy(asc(reviewerApplications.createdAt));
  const ids = rows.map((r) => r.application.userId);
  const [logRows, answerRows] =
    ids.length === 0
      ? [[], []]
      : await Promise.all([
          db.select({ userId: bringUpLogs.ownerId, n: count() }).from(bringUpLogs).where(inArray(bringUpLogs.ownerId, ids)).groupBy(bringUpLogs.ownerId),
          db
            .select({ userId: answers.authorId, n: count() })
            .from(answers)
            .where(and(inArray(answers.authorId, ids), eq(answers.state, "visible")))
            .groupBy(answers.authorId),
        ]);
  const countOf = (list: { userId: string; n: number }[], id: string) => list.find((r) => r.userId === id)?.n ?? 0;
  return rows.map((r) => ({
    ...r.application,
    applicantName: r.applicantName,
    applicantEmail: r.applicantEmail,
    logs: countOf(logRows, r.application.userId),
    answers: countOf(answerRows, r.application.userId),
  }));
}

function assertVetter(actor: SessionUser, applicationId: string): void {
  if (!hasRole(actor, "moderator")) throw new ReviewError(403, "Only a moderator or an admin vets reviewers.");
  if (!UUID.test(applicationId)) throw new ReviewError(404, "No such application.");
}

async function lockPendingApplication(tx: Tx, actor: SessionUser, applicationId: string): Promise<ReviewerApplicationRow> {
  const [application] = await tx.select().from(reviewerApplications).where(eq(reviewerApplications.id, applicationId)).for("update");
  if (!application) throw new ReviewError(404, "No such application.");
  if (application.userId === actor.id) throw new ReviewError(403, "Nobody vets their own application; another moderator must.");
  if (application.status !== "pending") throw new ReviewError(409, `This application was already ${application.status}.`);
  return application;
}

/**
 * Approves an application: in one transaction the reviewer role is granted, the reviewer profile
 * made (or brought up to date, keeping any payout account), the audit entry written and the e-mail queued.
 */
export async function approveReviewerApplication({ actor, applicationId }: { actor: SessionUser; applicationId: string }): Promise<void> {
  assertVetter(actor, applicationId);
  const mailIds = await db.transaction(async (tx) => {
    const application = await lockPendingApplication(tx, actor, applicationId);
    const now = new Date();
    const fields = { expertise: application.expertise, profileMd: application.profileMd, priceMinor: application.priceMinor, currency: application.currency };
    await tx.insert(userRoles).values({ userId: application.userId, role: "reviewer", grantedBy: actor.id }).onConflictDoNothing();
    await tx
      .insert(reviewerProfiles)
      .values({ userId: application.userId, ...fields })
      .onConflictDoUpdate({ target: reviewerProfiles.userId, set: { ...fields, updatedAt: now } });
    await tx.update(reviewerApplications).set({ status: "approved", decidedBy: actor.id, decidedAt: now, decisionReason: null }).where(eq(reviewerApplications.id, application.id));
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: "reviewer.approved",
      subjectType: "reviewer_application",
      subjectId: application.id,
      details: { userId: application.userId, expertise: application.expertise, priceMinor: application.priceMinor },
    });
    const applicant = await person(tx, application.userId);
    if (!applicant.email) return [];
    return [await enqueueMail(tx, { template: reviewerApprovedMail, to: applicant.email, props: { applicantName: applicant.name ?? applicant.email, deskUrl: appUrl("/reviews") } })];
  });
  await dispatchMail(mailIds);
}

export async function declineReviewerApplication({ actor, applicationId, reason }: { actor: SessionUser; applicationId: string; reason: string }): Promise<void> {
  assertVetter(actor, applicationId);
  const text = reason.trim();
  if (text.length < 3) throw new ReviewError(422, "Say why the application is declined; the applicant reads this.", { reason: ["Say why the application is declined."] });
  const mailIds = await db.transaction(async (tx) => {
    const application = await lockPendingApplication(tx, actor, applicationId);
    await tx
      .update(reviewerApplications)
      .set({ status: "declined", decidedBy: actor.id, decidedAt: new Date(), decisionReason: text })
      .where(and(eq(reviewerApplications.id, application.id), eq(reviewerApplications.status, "pending")));
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: "reviewer.declined",
      subjectType: "reviewer_application",
      subjectId: application.id,
      reason: text,
      details: { userId: application.userId },
    });
    const applicant = await person(tx, application.userId);
    if (!applicant.email) return [];
    return [
      await enqueueMail(tx, { template: reviewerDeclinedMail, to: applicant.email, props: { applicantName: applicant.name ?? applicant.email, reason: text, applyUrl: appUrl("/reviewers/apply") } }),
    ];
  });
  await dispatchMail(mailIds);
}

// ——— Reviewer profiles and payouts ———

export type ReviewerCard = { userId: string; name: string; expertise: string[]; profileMd: string; priceMinor: number; currency: string };

/** Reviewers builders can book now: vetted (role and profile), available, and able to be paid. */
export async function availableReviewers(): Promise<ReviewerCard[]> {
  const rows = await db
    .select({
      userId: reviewerProfiles.userId,
      name: users.name,
      expertise: reviewerProfiles.expertise,
      profileMd: reviewerProfiles.profileMd,
      priceMinor: reviewerProfiles.priceMinor,
      currency: reviewerProfiles.currency,
    })
    .from(reviewerProfiles)
    .innerJoin(users, eq(users.id, reviewerProfiles.userId))
    .innerJoin(userRoles, and(eq(userRoles.userId, reviewerProfiles.userId), eq(userRoles.role, "reviewer")))
    .where(and(eq(reviewerProfiles.available, true), eq(reviewerProfiles.payoutsEnabled, true)))
    .orderBy(asc(users.name));
  return rows.map((r) => ({ ...r, name: nameOf(r) }));
}

/** The first connected account stays: a second click or a race never links two accounts to one reviewer. */
export async function attachReviewerPayoutAccount(userId: string, accountId: string): Promise<string> {
  const [updated] = await db
    .update(reviewerProfiles)
    .set({ payoutAccountId: accountId, updatedAt: new Date() })
    .where(and(eq(reviewerProfiles.userId, userId), isNull(reviewerProfiles.payoutAccountId)))
    .returning({ id: reviewerProfiles.payoutAccountId });
  if (updated?.id) return updated.id;
  const profile = await getReviewerProfile(userId);
  if (!profile?.payoutAccountId) throw new ReviewError(404, "Your reviewer profile is not set up yet.");
  return profile.payoutAccountId;
}

export async function recordReviewerPayoutStatus(userId: string, accountId: string, payoutsEnabled: boolean): Promise<void> {
  await db
    .update(reviewerProfiles)
    .set({ payoutsEnabled, updatedAt: new Date() })
    .where(and(eq(reviewerProfiles.userId, userId), eq(reviewerProfiles.payoutAccountId, accountId)));
}

export async function setReviewerAvailability(userId: string, available: boolean): Promise<void> {
  await db.transaction(async (tx) => {
    const [row] = await tx.update(reviewerProfiles).set({ available, updatedAt: new Date() }).where(eq(reviewerProfiles.userId, userId)).returning({ userId: reviewerProfiles.userId });
    if (!row) throw new ReviewError(404, "You have no reviewer profile yet.");
    await tx.insert(auditLog).values({ actorId: userId, action: available ? "reviewer.available" : "reviewer.unavailable", subjectType: "reviewer_profile", subjectId: userId });
  });
}

// ——— Booking ———

async function platformFeeBps(executor: Executor): Promise<number> {
  const [row] = await executor.select({ feeBps: platformSettings.feeBps }).from(platformSettings).where(eq(platformSettings.id, 1));
  if (!row) throw new Error("platform_settings has no row 1: the migrations seed it");
  return row.feeBps;
}

export type BookingQuote = {
  reviewSessionId: string;
  logId: string;
  logTitle: string;
  builderId: string;
  reviewerId: string;
  reviewerName: string;
  stages: BringUpStage[];
  message: string;
  priceMinor: number;
  currency: string;
  feeBps: number;
  feeMinor: number;
  reviewerShareMinor: number;
};

/**
 * Checks a booking before any money is asked for: the builder's own log, a bookable reviewer who is
 * not the builder, checkpoints in the chosen stages, no open session of the same log with the same
 * reviewer; and prices it with the platform's current fee.
 */
export async function quoteBooking(builder: { id: string }, input: BookingInput): Promise<BookingQuote> {
  if (input.reviewerId === builder.id) {
    throw new ReviewError(403, "Nobody reviews their own bring-up; pick another reviewer.", { reviewerId: ["Pick a reviewer other than yourself."] });
  }
  const [log] = await db.select({ id: bringUpLogs.id, ownerId: bringUpLogs.ownerId, title: bringUpLogs.title }).from(bringUpLogs).where(eq(bringUpLogs.id, input.logId));
  if (!log || log.ownerId !== builder.id) throw new ReviewError(404, "Pick one of your own bring-up logs.", { logId: ["Pick one of your own bring-up logs."] });
  const reviewer = (await availableReviewers()).find((r) => r.userId === input.reviewerId);
  if (!reviewer) throw new ReviewError(409, "This reviewer is not taking bookings just now; pick another.", { reviewerId: ["This reviewer is not taking bookings just now."] });
  const [inScope] = await db
    .select({ n: count() })
    .from(logCheckpoints)
    .where(and(eq(logCheckpoints.logId, log.id), inArray(logCheckpoints.stage, input.stages)));
  if (!inScope || inScope.n === 0) {
    throw new ReviewError(422, "The log has no checkpoints in the chosen stages.", { stages: ["Pick stages that have checkpoints in this log."] });
  }
  const [open] = await db
    .select({ id: reviewSessions.id })
    .from(reviewSessions)
    .where(and(eq(reviewSessions.logId, log.id), eq(reviewSessions.reviewerId, reviewer.userId), inArray(reviewSessions.state, OPEN_STATES)));
  if (open) throw new ReviewError(409, "This reviewer already has an open request for this log.", { reviewerId: ["An open request for this log is with this reviewer already."] });
  const feeBps = await platformFeeBps(db);
  return {
    reviewSessionId: crypto.randomUUID(),
    logId: log.id,
    logTitle: log.title,
    builderId: builder.id,
    reviewerId: reviewer.userId,
    reviewerName: reviewer.name,
    stages: input.stages,
    message: input.message,
    priceMinor: reviewer.priceMinor,
    currency: reviewer.currency,
    feeBps,
    ...reviewSplit(reviewer.priceMinor, feeBps),
  };
}

const bookingMetadataSchema = z.object({
  reviewSessionId: z.uuid(),
  logId: z.uuid(),
  builderId: z.string().min(1),
  reviewerId: z.string().min(1),
  stages: z.string().transform((s, ctx) => {
    const list = s.split(",").filter((x) => x !== "");
    if (list.length === 0 || list.some((x) => !(BRING_UP_STAGES as readonly string[]).includes(x))) {
      ctx.addIssue({ code: "custom", message: "unknown stages" });
      return z.NEVER;
    }
    return list as BringUpStage[];
  }),
  priceMinor: z.coerce.number().int().positive(),
  feeBps: z.coerce.number().int().min(0).max(10_000),
  message: z.string().default(""),
});

export type RecordedBooking = { kind: "created" | "existing"; sessionId: string } | { kind: "refused"; message: string };

/**
 * Turns an authorised payment into a booking: the review session row in `requested`, with 48 hours
 * for the reviewer to answer, its audit entry and the reviewer's e-mail. Called from the builder's
 * return from the payment page and from the provider's event; whichever comes second finds the row.
 * The log row is locked, so two bookings of one log are decided one after the other. A refusal
 * (the log changed hands, an open session appeared meanwhile) leaves the hold for the caller to release.
 */
export async function recordAuthorisedBooking(held: HeldPayment, now = new Date()): Promise<RecordedBooking> {
  const parsed = bookingMetadataSchema.safeParse(held.metadata);
  if (!parsed.success) return { kind: "refused", message: "The payment does not belong to a review booking." };
  const meta = parsed.data;
  const { result, mailIds } = await db.transaction(async (tx): Promise<{ result: RecordedBooking; mailIds: string[] }> => {
    const [log] = await tx.select({ id: bringUpLogs.id, ownerId: bringUpLogs.ownerId, title: bringUpLogs.title }).from(bringUpLogs).where(eq(bringUpLogs.id, meta.logId)).for("update");
    const [existing] = await tx
      .select({ id: reviewSessions.id })
      .from(reviewSessions)
      .where(or(eq(reviewSessions.id, meta.reviewSessionId), eq(reviewSessions.paymentIntentId, held.paymentIntentId)));
    if (existing) return { result: { kind: "existing", sessionId: existing.id }, mailIds: [] };
    if (!log || log.ownerId !== meta.builderId) return { result: { kind: "refused", message: "The log is no longer yours to book." }, mailIds: [] };
    if (meta.reviewerId === meta.builderId) return { result: { kind: "refused", message: "Nobody reviews their own bring-up." }, mailIds: [] };
    if (!(await getReviewerProfile(meta.reviewerId, tx))) return { result: { kind: "refused", message: "The reviewer no longer offers reviews." }, mailIds: [] };
    if (held.amountMinor !== meta.priceMinor || held.currency !== REVIEW_CURRENCY) return { result: { kind: "refused", message: "The amount held is not the price of the review." }, mailIds: [] };
    const [open] = await tx
      .select({ id: reviewSessions.id })
      .from(reviewSessions)
      .where(and(eq(reviewSessions.logId, log.id), eq(reviewSessions.reviewerId, meta.reviewerId), inArray(reviewSessions.state, OPEN_STATES)));
    if (open) return { result: { kind: "refused", message: "This reviewer already has an open request for this log." }, mailIds: [] };

    const split = reviewSplit(meta.priceMinor, meta.feeBps);
    const respondBy = respondByFrom(now);
    const [row] = await tx
      .insert(reviewSessions)
      .values({
        id: meta.reviewSessionId,
        logId: log.id,
        builderId: meta.builderId,
        reviewerId: meta.reviewerId,
        stages: meta.stages,
        state: "requested",
        priceMinor: meta.priceMinor,
        currency: held.currency,
        feeBps: meta.feeBps,
        feeMinor: split.feeMinor,
        reviewerShareMinor: split.reviewerShareMinor,
        paymentIntentId: held.paymentIntentId,
        message: meta.message,
        respondBy,
        createdAt: now,
        updatedAt: now,
      })
      .onConflictDoNothing()
      .returning({ id: reviewSessions.id });
    if (!row) return { result: { kind: "existing", sessionId: meta.reviewSessionId }, mailIds: [] };
    await tx.insert(auditLog).values({
      actorId: meta.builderId,
      action: "review.booked",
      subjectType: "review_session",
      subjectId: row.id,
      details: { logId: log.id, reviewerId: meta.reviewerId, stages: meta.stages, priceMinor: meta.priceMinor, feeMinor: split.feeMinor, paymentIntentId: held.paymentIntentId },
    });
    const builder = await person(tx, meta.builderId);
    const reviewer = await person(tx, meta.reviewerId);
    const mailIds = reviewer.email
      ? [
          await enqueueMail(tx, {
            template: reviewRequestedMail,
            to: reviewer.email,
            props: {
              reviewerName: nameOf(reviewer),
              builderName: nameOf(builder),
              logTitle: log.title,
              stages: stageList(meta.stages),
              share: formatMoney(split.reviewerShareMinor, held.currency),
              respondBy: formatWhen(respondBy),
              message: meta.message,
              sessionUrl: appUrl(`/reviews/${row.id}`),
            },
          }),
        ]
      : [];
    return { result: { kind: "created", sessionId: row.id }, mailIds };
  });
  await dispatchMail(mailIds);
  return result;
}

// ——— The session's transitions ———

async function lockSession(tx: Tx, sessionId: string): Promise<ReviewSession> {
  if (!UUID.test(sessionId)) throw new ReviewError(404, NO_SESSION);
  const [row] = await tx.select().from(reviewSessions).where(eq(reviewSessions.id, sessionId)).for("update");
  if (!row) throw new ReviewError(404, NO_SESSION);
  return row;
}

function factsOf(row: ReviewSession): SessionFacts {
  return { state: row.state, builderId: row.builderId, reviewerId: row.reviewerId, createdAt: row.createdAt, respondBy: row.respondBy, disputeBy: row.disputeBy };
}

function actorOf(user: SessionUser | null): ReviewActor {
  return user ? { kind: "user", id: user.id, roles: user.roles } : { kind: "system" };
}

/** Someone with no part in a session learns nothing about it; a party or a moderator gets the real reason. */
function assertInvolved(row: ReviewSession, user: SessionUser | null): void {
  if (user === null) return;
  if (user.id === row.builderId || user.id === row.reviewerId || hasRole(user, "moderator")) return;
  throw new ReviewError(404, NO_SESSION);
}

async function planOrRefuse(row: ReviewSession, action: ReviewAction, user: SessionUser | null, now: Date) {
  assertInvolved(row, user);
  const plan = planReviewTransition({ session: factsOf(row), action, actor: actorOf(user), now });
  if (!plan.ok) throw new ReviewError(plan.status, plan.message);
  return plan;
}

/** The state change itself, conditional on the state it was planned from, so it happens once however many try. */
async function moveState(tx: Tx, row: ReviewSession, from: ReviewState, set: Partial<typeof reviewSessions.$inferInsert>): Promise<void> {
  const [moved] = await tx
    .update(reviewSessions)
    .set({ ...set, updatedAt: new Date() })
    .where(and(eq(reviewSessions.id, row.id), eq(reviewSessions.state, from)))
    .returning({ id: reviewSessions.id });
  if (!moved) throw new ReviewError(409, "This review session changed meanwhile; reload the page.");
}

function audit(tx: Tx, row: ReviewSession, actorId: string | null, action: string, details: Record<string, unknown> = {}, reason?: string) {
  return tx.insert(auditLog).values({ actorId, action, subjectType: "review_session", subjectId: row.id, details, ...(reason ? { reason } : {}) });
}

async function logTitleOf(executor: Executor, logId: string): Promise<string> {
  const [log] = await executor.select({ title: bringUpLogs.title }).from(bringUpLogs).where(eq(bringUpLogs.id, logId));
  return log?.title ?? "your bring-up log";
}

/** Both parties and the log's title; one after the other, since a transaction's client runs one query at a time. */
async function partiesOf(tx: Tx, row: ReviewSession) {
  const builder = await person(tx, row.builderId);
  const reviewer = await person(tx, row.reviewerId);
  const logTitle = await logTitleOf(tx, row.logId);
  return { builder, reviewer, logTitle };
}

type SessionMailProps = { builderName: string; reviewerName: string; logTitle: string; sessionUrl: string };

/**
 * Mail the builder about their session with the names, log title and link every such mail
 * carries, plus the template's own props; nothing when the builder has no address.
 */
async function mailBuilderAbout<P extends SessionMailProps>(
  tx: Tx,
  row: ReviewSession,
  template: { name: string; template: MailTemplate<P> },
  extra: Omit<P, keyof SessionMailProps>,
): Promise<string[]> {
  const { builder, reviewer, logTitle } = await partiesOf(tx, row);
  if (!builder.email) return [];
  const common: SessionMailProps = { builderName: nameOf(builder), reviewerName: nameOf(reviewer), logTitle, sessionUrl: appUrl(`/reviews/${row.id}`) };
  return [await enqueueMail(tx, { template, to: builder.email, props: { ...common, ...extra } as P })];
}

function releasedMail(tx: Tx, row: ReviewSession, why: "declined" | "expired", note: string): Promise<string[]> {
  return mailBuilderAbout(tx, row, reviewReleasedMail, { amount: formatMoney(row.priceMinor, row.currency), why, note, reviewersUrl: appUrl("/reviewers") });
}

export async function acceptReview({ actor, sessionId, now = new Date() }: { actor: SessionUser; sessionId: string; now?: Date }): Promise<void> {
  const mailIds = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = await planOrRefuse(row, "accept", actor, now);
    await moveState(tx, row, plan.from, { state: plan.to, acceptedAt: now });
    await audit(tx, row, actor.id, "review.accepted", { from: plan.from, to: plan.to });
    return mailBuilderAbout(tx, row, reviewAcceptedMail, { deliverBy: formatWhen(deliverBy(row)) });
  });
  await dispatchMail(mailIds);
}

/** The reviewer says no: the session is declined and, after commit, the builder's hold released. */
export async function declineReview({ actor, sessionId, reason, now = new Date() }: { actor: SessionUser; sessionId: string; reason: string; now?: Date }): Promise<{ released: boolean }> {
  const mailIds = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = await planOrRefuse(row, "decline", actor, now);
    await moveState(tx, row, plan.from, { state: plan.to, closedAt: now });
    await audit(tx, row, actor.id, "review.declined", { from: plan.from, to: plan.to }, reason || undefined);
    return releasedMail(tx, row, "declined", reason);
  });
  await dispatchMail(mailIds);
  return { released: await releaseSessionHold(sessionId) };
}

/** The platform's expiry of one session whose time ran out; false when it is not (or no longer) due. */
export async function expireReview(sessionId: string, now = new Date()): Promise<boolean> {
  const outcome = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = planReviewTransition({ session: factsOf(row), action: "expire", actor: { kind: "system" }, now });
    if (!plan.ok) return null;
    await moveState(tx, row, plan.from, { state: plan.to, closedAt: now });
    await audit(tx, row, null, "review.expired", { from: plan.from, to: plan.to });
    return releasedMail(tx, row, "expired", "");
  });
  if (outcome === null) return false;
  await dispatchMail(outcome);
  await releaseSessionHold(sessionId);
  return true;
}

/** Delivered and not disputed within 7 days: the session closes and the payment stands. */
export async function closeReview(sessionId: string, now = new Date()): Promise<boolean> {
  return db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = planReviewTransition({ session: factsOf(row), action: "close", actor: { kind: "system" }, now });
    if (!plan.ok) return false;
    await moveState(tx, row, plan.from, { state: plan.to, closedAt: now });
    await audit(tx, row, null, "review.closed", { from: plan.from, to: plan.to });
    return true;
  });
}

function logProviderTrouble(what: string, sessionId: string, outcome: Exclude<ProviderOutcome<unknown>, { kind: "done" }>): void {
  console.error(`[reviews] ${what} for session ${sessionId} did not go through (${outcome.kind}); the sweep tries again:`, outcome.message);
}

/**
 * Releases the hold of a declined or expired session at the provider, once: `releasedAt` records it,
 * the call's idempotency key guards a repeat. Returns whether it is released now.
 */
export async function releaseSessionHold(sessionId: string): Promise<boolean> {
  const [row] = await db.select().from(reviewSessions).where(eq(reviewSessions.id, sessionId));
  if (!row || !row.paymentIntentId || (row.state !== "declined" && row.state !== "expired")) return false;
  if (row.releasedAt) return true;
  const outcome = await releaseHeldPayment(row.paymentIntentId, row.id);
  if (outcome.kind !== "done") {
    logProviderTrouble("releasing the payment", row.id, outcome);
    return false;
  }
  await db.transaction(async (tx) => {
    const [marked] = await tx
      .update(reviewSessions)
      .set({ releasedAt: new Date(), updatedAt: new Date() })
      .where(and(eq(reviewSessions.id, row.id), isNull(reviewSessions.releasedAt)))
      .returning({ id: reviewSessions.id });
    if (marked) await audit(tx, row, null, "review.payment_released", { paymentIntentId: row.paymentIntentId, state: row.state });
  });
  return true;
}

const COLLECTING_STATES: ReviewState[] = ["delivered", "disputed", "closed"];

/**
 * After delivery: captures the held payment (once — `capturedAt` is set by a conditional update, and
 * the provider call carries the session's idempotency key, so a second caller replays the first
 * capture rather than making one), then sends the reviewer's share to their payout account.
 */
export async function collectReviewPayment(sessionId: string): Promise<{ captured: boolean; transferred: boolean }> {
  let [row] = await db.select().from(reviewSessions).where(eq(reviewSessions.id, sessionId));
  if (!row || !row.paymentIntentId || !COLLECTING_STATES.includes(row.state)) return { captured: false, transferred: false };
  const intentId = row.paymentIntentId;
  if (!row.capturedAt) {
    const outcome = await captureHeldPayment(intentId, row.id);
    if (outcome.kind !== "done") {
      logProviderTrouble("capturing the payment", row.id, outcome);
      return { captured: false, transferred: false };
    }
    const current = row;
    row = await db.transaction(async (tx) => {
      const [marked] = await tx
        .update(reviewSessions)
        .set({ capturedAt: new Date(), updatedAt: new Date() })
        .where(and(eq(reviewSessions.id, current.id), isNull(reviewSessions.capturedAt)))
        .returning();
      if (marked) await audit(tx, current, null, "review.payment_captured", { paymentIntentId: intentId, amountMinor: current.priceMinor });
      const [fresh] = await tx.select().from(reviewSessions).where(eq(reviewSessions.id, current.id));
      return fresh ?? current;
    });
  }
  if (row.transferId) return { captured: true, transferred: true };
  const due = reviewerShareDue(row);
  if (due <= 0) return { captured: true, transferred: false };
  const profile = await getReviewerProfile(row.reviewerId);
  if (!profile?.payoutAccountId) {
    console.error(`[reviews] reviewer ${row.reviewerId} has no payout account; the share of session ${row.id} waits`);
    return { captured: true, transferred: false };
  }
  const transfer = await transferReviewerShare({ reviewSessionId: row.id, paymentIntentId: intentId, amountMinor: due, currency: row.currency, destination: profile.payoutAccountId });
  if (transfer.kind !== "done") {
    logProviderTrouble("sending the reviewer's share", row.id, transfer);
    return { captured: true, transferred: false };
  }
  const settled = row;
  await db.transaction(async (tx) => {
    const [marked] = await tx
      .update(reviewSessions)
      .set({ transferId: transfer.value.id, updatedAt: new Date() })
      .where(and(eq(reviewSessions.id, settled.id), isNull(reviewSessions.transferId)))
      .returning({ id: reviewSessions.id });
    if (marked) await audit(tx, settled, null, "review.share_transferred", { transferId: transfer.value.id, amountMinor: due, destination: profile.payoutAccountId });
  });
  return { captured: true, transferred: true };
}

/** The checkpoints a session covers: the log's checkpoints in the booked stages. */
async function scopeCheckpointIds(executor: Executor, row: ReviewSession): Promise<string[]> {
  const rows = await executor
    .select({ id: logCheckpoints.id })
    .from(logCheckpoints)
    .where(and(eq(logCheckpoints.logId, row.logId), inArray(logCheckpoints.stage, row.stages as BringUpStage[])));
  return rows.map((r) => r.id);
}

/**
 * The reviewer delivers the report: a verdict for exactly the checkpoints in scope and a summary.
 * The state moves first (conditionally, under the row lock, so two deliveries cannot both pass);
 * after commit the payment is captured and the share sent.
 */
export async function deliverReport({ actor, sessionId, report, now = new Date() }: { actor: SessionUser; sessionId: string; report: ReportInput; now?: Date }) {
  const mailIds = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = await planOrRefuse(row, "deliver", actor, now);
    const scope = new Set(await scopeCheckpointIds(tx, row));
    const given = report.verdicts.map((v) => v.checkpointId);
    if (new Set(given).size !== given.length) throw new ReviewError(422, "Each checkpoint gets one verdict.", { verdicts: ["Each checkpoint gets one verdict."] });
    const outside = given.filter((id) => !scope.has(id));
    if (outside.length > 0) throw new ReviewError(422, "A verdict is for a checkpoint outside the booked stages.", { verdicts: ["Only the checkpoints in the booked stages get verdicts."] });
    if (given.length !== scope.size) throw new ReviewError(422, "Give a verdict for every checkpoint in the booked stages.", { verdicts: ["Give a verdict for every checkpoint in the booked stages."] });

    const disputeBy = disputeByFrom(now);
    await moveState(tx, row, plan.from, { state: plan.to, deliveredAt: now, disputeBy });
    await tx.insert(reviewReports).values({ sessionId: row.id, summaryMd: report.summaryMd, createdAt: now });
    await tx.insert(reviewVerdicts).values(report.verdicts.map((v) => ({ sessionId: row.id, checkpointId: v.checkpointId, verdict: v.verdict, comment: v.comment })));
    const tally = (verdict: CheckpointVerdict) => report.verdicts.filter((v) => v.verdict === verdict).length;
    await audit(tx, row, actor.id, "review.delivered", { from: plan.from, to: plan.to, fine: tally("fine"), needsAttention: tally("needs_attention"), stop: tally("stop") });
    return mailBuilderAbout(tx, row, reviewDeliveredMail, {
      amount: formatMoney(row.priceMinor, row.currency),
      stops: tally("stop"),
      attention: tally("needs_attention"),
      fine: tally("fine"),
      disputeBy: formatWhen(disputeBy),
    });
  });
  await dispatchMail(mailIds);
  return collectReviewPayment(sessionId);
}

export async function disputeReview({ actor, sessionId, reason, now = new Date() }: { actor: SessionUser; sessionId: string; reason: string; now?: Date }): Promise<void> {
  const mailIds = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = await planOrRefuse(row, "dispute", actor, now);
    await moveState(tx, row, plan.from, { state: plan.to });
    const [dispute] = await tx.insert(reviewDisputes).values({ sessionId: row.id, reason, createdAt: now }).returning({ id: reviewDisputes.id });
    await audit(tx, row, actor.id, "review.disputed", { from: plan.from, to: plan.to, disputeId: dispute?.id }, reason);
    const { builder, reviewer, logTitle } = await partiesOf(tx, row);
    if (!reviewer.email) return [];
    return [
      await enqueueMail(tx, {
        template: reviewDisputedMail,
        to: reviewer.email,
        props: { reviewerName: nameOf(reviewer), builderName: nameOf(builder), logTitle, reason, sessionUrl: appUrl(`/reviews/${row.id}`) },
      }),
    ];
  });
  await dispatchMail(mailIds);
}

const OUTCOME_COLUMN = { payment_stands: "closed_payment_stands", refund_full: "refunded_full", refund_partial: "refunded_partial" } as const;

function providerRefusal(what: string, outcome: Exclude<ProviderOutcome<unknown>, { kind: "done" }>): ReviewError {
  if (outcome.kind === "unknown") return new ReviewError(503, `The payment provider did not answer the ${what}; nothing is decided yet — try again in a minute (it will not be paid twice).`);
  return new ReviewError(409, `The payment provider refused the ${what}: ${outcome.message}`);
}

/**
 * A moderator settles a dispute: the payment stands, or part or all of it goes back to the builder
 * (refunded on the captured payment, the reviewer's part taken back from their transfer, the fee's
 * part given up pro rata). The provider calls run under the session's row lock and before commit,
 * each with the dispute's idempotency key: if one fails nothing here changes, and trying again
 * repeats the call without moving the money twice.
 */
export async function settleDispute({ actor, sessionId, decision, now = new Date() }: { actor: SessionUser; sessionId: string; decision: SettleDisputeInput; now?: Date }) {
  if (!hasRole(actor, "moderator")) throw new ReviewError(403, "Only a moderator can settle a dispute.");
  const mailIds = await db.transaction(async (tx) => {
    const row = await lockSession(tx, sessionId);
    const plan = await planOrRefuse(row, "settle", actor, now);
    const [dispute] = await tx
      .select()
      .from(reviewDisputes)
      .where(and(eq(reviewDisputes.sessionId, row.id), eq(reviewDisputes.outcome, "open")))
      .orderBy(desc(reviewDisputes.createdAt))
      .limit(1)
      .for("update");
    if (!dispute) throw new ReviewError(409, "This session has no open dispute.");

    const refundable = row.priceMinor - row.refundedMinor;
    let refundMinor = 0;
    if (decision.outcome === "refund_full") refundMinor = refundable;
    if (decision.outcome === "refund_partial") {
      refundMinor = decision.refundMinor ?? 0;
      if (refundMinor >= refundable) {
        throw new ReviewError(422, `A part refund is less than the ${formatMoney(refundable, row.currency)} paid; choose "refund in full" for all of it.`, { amount: [`Less than ${formatMoney(refundable, row.currency)}.`] });
      }
    }
    let refundId: string | null = null;
    let reversalId: string | null = null;
    const parts = refundMinor > 0 ? refundParts(row, refundMinor) : { feeMinor: 0, reviewerMinor: 0 };
    if (refundMinor > 0) {
      if (!row.capturedAt || !row.paymentIntentId) throw new ReviewError(409, "The payment is still being collected; try again in a few minutes.");
      const refund = await refundReviewPayment({ disputeId: dispute.id, reviewSessionId: row.id, paymentIntentId: row.paymentIntentId, amountMinor: refundMinor });
      if (refund.kind !== "done") throw providerRefusal("refund", refund);
      refundId = refund.value.id;
      // A share not yet sent is simply sent smaller (reviewerShareDue); one already sent is partly taken back.
      if (row.transferId && parts.reviewerMinor > 0) {
        const reversal = await reverseReviewerShare({ disputeId: dispute.id, transferId: row.transferId, amountMinor: parts.reviewerMinor });
        if (reversal.kind !== "done") throw providerRefusal("reversal of the reviewer's share", reversal);
        reversalId = reversal.value.id;
      }
    }

    await tx
      .update(reviewDisputes)
      .set({ outcome: OUTCOME_COLUMN[decision.outcome], refundMinor: refundMinor > 0 ? refundMinor : null, decidedBy: actor.id, decisionNote: decision.note, decidedAt: now })
      .where(eq(reviewDisputes.id, dispute.id));
    await moveState(tx, row, plan.from, { state: plan.to, closedAt: now, refundedMinor: row.refundedMinor + refundMinor });
    await audit(
      tx,
      row,
      actor.id,
      "review.dispute_settled",
      { from: plan.from, to: plan.to, disputeId: dispute.id, outcome: decision.outcome, refundMinor, feeRefundMinor: parts.feeMinor, reviewerRefundMinor: parts.reviewerMinor, refundId, reversalId },
      decision.note,
    );
    const { builder, reviewer, logTitle } = await partiesOf(tx, row);
    const common = { logTitle, outcome: SETTLE_LABELS[decision.outcome], refund: refundMinor > 0 ? formatMoney(refundMinor, row.currency) : null, note: decision.note, sessionUrl: appUrl(`/reviews/${row.id}`) };
    const ids: string[] = [];
    if (builder.email) ids.push(await enqueueMail(tx, { template: reviewDisputeSettledMail, to: builder.email, props: { ...common, name: nameOf(builder), role: "builder" } }));
    if (reviewer.email) ids.push(await enqueueMail(tx, { template: reviewDisputeSettledMail, to: reviewer.email, props: { ...common, name: nameOf(reviewer), role: "reviewer" } }));
    return ids;
  });
  await dispatchMail(mailIds);
}

// ——— What the sweep finds to do ———

export async function sessionsDueForExpiry(now: Date): Promise<string[]> {
  const rows = await db
    .select({ id: reviewSessions.id })
    .from(reviewSessions)
    .where(
      or(
        and(eq(reviewSessions.state, "requested"), lte(reviewSessions.respondBy, now)),
        and(eq(reviewSessions.state, "accepted"), lte(reviewSessions.createdAt, new Date(now.getTime() - DELIVERY_WINDOW_MS))),
      ),
    );
  return rows.map((r) => r.id);
}

export async function sessionsDueForClosing(now: Date): Promise<string[]> {
  const rows = await db
    .select({ id: reviewSessions.id })
    .from(reviewSessions)
    .where(and(eq(reviewSessions.state, "delivered"), lte(reviewSessions.disputeBy, now)));
  return rows.map((r) => r.id);
}

/** Declined or expired sessions whose hold the provider has not confirmed released. */
export async function releasesDue(): Promise<string[]> {
  const rows = await db
    .select({ id: reviewSessions.id })
    .from(reviewSessions)
    .where(and(inArray(reviewSessions.state, ["declined", "expired"]), isNull(reviewSessions.releasedAt), isNotNull(reviewSessions.paymentIntentId)));
  return rows.map((r) => r.id);
}

/** Delivered sessions whose capture or transfer did not go through yet. */
export async function collectionsDue(): Promise<string[]> {
  const rows = await db
    .select({ id: reviewSessions.id })
    .from(reviewSessions)
    .where(
      and(
        inArray(reviewSessions.state, COLLECTING_STATES),
        isNotNull(reviewSessions.paymentIntentId),
        or(isNull(reviewSessions.capturedAt), and(isNull(reviewSessions.transferId), lt(reviewSessions.refundedMinor, reviewSessions.priceMinor))),
      ),
    );
  return rows.map((r) => r.id);
}

// ——— Reading ———

export type SessionListItem = {
  id: string;
  state: ReviewState;
  logTitle: string;
  counterpart: string;
  stages: string[];
  priceMinor: number;
  reviewerShareMinor: number;
  currency: string;
  createdAt: Date;
  respondBy: Date;
};

/** The person's sessions as the builder who booked them and as the reviewer, newest first. */
export async function sessionsOf(userId: string): Promise<{ asBuilder: SessionListItem[]; asReviewer: SessionListItem[] }> {
  const list = async (as: "builder" | "reviewer") => {
    const mine = as === "builder" ? reviewSessions.builderId : reviewSessions.reviewerId;
    const other = as === "builder" ? reviewSessions.reviewerId : reviewSessions.builderId;
    const rows = await db
      .select({
        id: reviewSessions.id,
        state: reviewSessions.state,
        logTitle: bringUpLogs.title,
        counterpartName: users.name,
        stages: reviewSessions.stages,
        priceMinor: reviewSessions.priceMinor,
        reviewerShareMinor: reviewSessions.reviewerShareMinor,
        currency: reviewSessions.currency,
        createdAt: reviewSessions.createdAt,
        respondBy: reviewSessions.respondBy,
      })
      .from(reviewSessions)
      .innerJoin(bringUpLogs, eq(bringUpLogs.id, reviewSessions.logId))
      .innerJoin(users, eq(users.id, other))
      .where(eq(mine, userId))
      .orderBy(desc(reviewSessions.createdAt));
    return rows.map(({ counterpartName, ...r }) => ({ ...r, counterpart: nameOf({ name: counterpartName }) }));
  };
  const [asBuilder, asReviewer] = await Promise.all([list("builder"), list("reviewer")]);
  return { asBuilder, asReviewer };
}

export type VerdictView = { checkpointId: string; checkpointName: string; stage: BringUpStage; verdict: CheckpointVerdict; comment: string };
export type DisputeView = typeof reviewDisputes.$inferSelect;

export type SessionDetail = ReviewSession & {
  /** how the viewer stands to this session */
  viewerRole: "builder" | "reviewer" | "moderator";
  logTitle: string;
  builderName: string;
  reviewerName: string;
  report: { summaryMd: string; createdAt: Date; verdicts: VerdictView[] } | null;
  disputes: DisputeView[];
};

/** The session for one of its two parties or a moderator; null for anyone else (and for an unknown id). */
export async function sessionForViewer(viewer: SessionUser, sessionId: string): Promise<SessionDetail | null> {
  if (!UUID.test(sessionId)) return null;
  const [row] = await db.select().from(reviewSessions).where(eq(reviewSessions.id, sessionId));
  if (!row) return null;
  const viewerRole = viewer.id === row.builderId ? "builder" : viewer.id === row.reviewerId ? "reviewer" : hasRole(viewer, "moderator") ? "moderator" : null;
  if (!viewerRole) return null;
  const [builder, reviewer, logTitle, reportRows, verdictRows, disputes] = await Promise.all([
    person(db, row.builderId),
    person(db, row.reviewerId),
    logTitleOf(db, row.logId),
    db.select().from(reviewReports).where(eq(reviewReports.sessionId, row.id)),
    db
      .select({ checkpointId: reviewVerdicts.checkpointId, checkpointName: logCheckpoints.name, stage: logCheckpoints.stage, position: logCheckpoints.position, verdict: reviewVerdicts.verdict, comment: reviewVerdicts.comment })
      .from(reviewVerdicts)
      .innerJoin(logCheckpoints, eq(logCheckpoints.id, reviewVerdicts.checkpointId))
      .where(eq(reviewVerdicts.sessionId, row.id)),
    db.select().from(reviewDisputes).where(eq(reviewDisputes.sessionId, row.id)).orderBy(asc(reviewDisputes.createdAt)),
  ]);
  const stageIndex = (s: BringUpStage) => BRING_UP_STAGES.indexOf(s);
  const verdicts = verdictRows
    .sort((a, b) => stageIndex(a.stage) - stageIndex(b.stage) || a.position - b.position)
    .map(({ position: _position, ...v }) => v);
  const report = reportRows[0] ? { summaryMd: reportRows[0].summaryMd, createdAt: reportRows[0].createdAt, verdicts } : null;
  return { ...row, viewerRole, logTitle, builderName: nameOf(builder), reviewerName: nameOf(reviewer), report, disputes };
}

export type OpenDispute = { sessionId: string; disputeId: string; reason: string; openedAt: Date };

/** Disputes waiting for a moderator, the oldest first. */
export async function openDisputes(): Promise<OpenDispute[]> {
  const rows = await db
    .select({ sessionId: reviewDisputes.sessionId, disputeId: reviewDisputes.id, reason: reviewDisputes.reason, openedAt: reviewDisputes.createdAt })
    .from(reviewDisputes)
    .innerJoin(reviewSessions, eq(reviewSessions.id, reviewDisputes.sessionId))
    .where(and(eq(reviewDisputes.outcome, "open"), eq(reviewSessions.state, "disputed")))
    .orderBy(asc(reviewDisputes.createdAt));
  return rows;
}

export async function reviewModerationCounts(): Promise<{ applications: number; disputes: number }> {
  const [[applications], [disputes]] = await Promise.all([
    db.select({ n: count() }).from(reviewerApplications).where(eq(reviewerApplications.status, "pending")),
    db.select({ n: count() }).from(reviewSessions).where(eq(reviewSessions.state, "disputed")),
  ]);
  return { applications: applications?.n ?? 0, disputes: disputes?.n ?? 0 };
}
