import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { auditLog, sellerApplications, sellerProfiles, userRoles, users, type SellerApplication } from "@/db/schema";
import { hasRole, type SessionUser } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import type { CountryCode } from "@/lib/validations/sellers";
import { sellerApprovedMail } from "@/emails/moderation/seller-approved";
import { sellerDeclinedMail } from "@/emails/moderation/seller-declined";
import { createSellerProfileInTx, SellerError } from "./sellers";
import { isUuid } from "@/lib/moderation/ids";

export class ApplicationError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422,
    message: string,
  ) {
    super(message);
    this.name = "ApplicationError";
  }
}

export type PendingApplication = SellerApplication & { applicantName: string | null; applicantEmail: string | null };

/** Applications waiting for a decision, the oldest first. */
export async function pendingApplications(): Promise<PendingApplication[]> {
  const rows = await db
    .select({ application: sellerApplications, applicantName: users.name, applicantEmail: users.email })
    .from(sellerApplications)
    .innerJoin(users, eq(users.id, sellerApplications.userId))
    .where(eq(sellerApplications.status, "pending"))
    .orderBy(asc(sellerApplications.createdAt));
  return rows.map((r) => ({ ...r.application, applicantName: r.applicantName, applicantEmail: r.applicantEmail }));
}

/** Checked before anything is read, so a person without the role learns nothing about applications. */
function assertModerator(actor: SessionUser, applicationId: string): void {
  if (!hasRole(actor, "moderator")) throw new ApplicationError(403, "Only a moderator or an admin decides seller applications.");
  if (!isUuid(applicationId)) throw new ApplicationError(404, "No such application.");
}

function assertNotOwn(actor: SessionUser, application: SellerApplication): void {
  if (actor.id === application.userId) throw new ApplicationError(403, "Nobody decides their own application; another moderator must.");
}

async function lockPending(tx: Tx, applicationId: string): Promise<SellerApplication> {
  const [application] = await tx.select().from(sellerApplications).where(eq(sellerApplications.id, applicationId)).for("update");
  if (!application) throw new ApplicationError(404, "No such application.");
  return application;
}

function assertPending(application: SellerApplication): void {
  if (application.status !== "pending") throw new ApplicationError(409, `This application was already ${application.status}.`);
}

async function applicant(tx: Tx, userId: string): Promise<{ email: string | null; name: string | null }> {
  const [row] = await tx.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, userId));
  return row ?? { email: null, name: null };
}

/**
 * Approves an application: in one transaction the application is marked approved, the seller role
 * granted, the shop created, the audit entry written and the applicant's e-mail queued.
 */
export async function approveApplication({ actor, applicationId }: { actor: SessionUser; applicationId: string }): Promise<{ slug: string }> {
  assertModerator(actor, applicationId);
  const { slug, mailIds } = await db.transaction(async (tx) => {
    const application = await lockPending(tx, applicationId);
    assertNotOwn(actor, application);
    assertPending(application);

    const [existing] = await tx.select({ slug: sellerProfiles.slug }).from(sellerProfiles).where(eq(sellerProfiles.userId, application.userId));
    const slug =
      existing?.slug ??
      (
        await createSellerProfileInTx(tx, application.userId, {
          shopName: application.shopName,
          profileMd: application.profileMd,
          country: application.country as CountryCode,
          returnsPolicyMd: application.returnsPolicyMd,
          returnsWindowDays: application.returnsWindowDays,
        }).catch((error: unknown) => {
          if (error instanceof SellerError) throw new ApplicationError(409, `${error.message} Decline with a note asking for another shop name.`);
          throw error;
        })
      ).slug;
    const now = new Date();
    await tx.insert(userRoles).values({ userId: application.userId, role: "seller", grantedBy: actor.id }).onConflictDoNothing();
    await tx
      .update(sellerApplications)
      .set({ status: "approved", decidedBy: actor.id, decidedAt: now, decisionReason: null })
      .where(eq(sellerApplications.id, application.id));
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: "seller.approved",
      subjectType: "seller_application",
      subjectId: application.id,
      details: { userId: application.userId, shopName: application.shopName, slug, profileExisted: Boolean(existing) },
    });

    const mailIds: string[] = [];
    const person = await applicant(tx, application.userId);
    if (person.email) {
      mailIds.push(
        await enqueueMail(tx, {
          template: sellerApprovedMail,
          to: person.email,
          props: { applicantName: person.name ?? person.email, shopName: application.shopName, sellerDeskUrl: `${env().APP_URL}/sell` },
        }),
      );
    }
    return { slug, mailIds };
  });
  await dispatchMail(mailIds);
  return { slug };
}

export async function declineApplication({ actor, applicationId, reason }: { actor: SessionUser; applicationId: string; reason: string }): Promise<void> {
  assertModerator(actor, applicationId);
  const text = reason.trim();
  if (text.length < 3) throw new ApplicationError(422, "Say why the application is declined; the applicant reads this.");
  const mailIds = await db.transaction(async (tx) => {
    const application = await lockPending(tx, applicationId);
    assertNotOwn(actor, application);
    assertPending(application);
    await tx
      .update(sellerApplications)
      .set({ status: "declined", decidedBy: actor.id, decidedAt: new Date(), decisionReason: text })
      .where(and(eq(sellerApplications.id, application.id), eq(sellerApplications.status, "pending")));
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: "seller.declined",
      subjectType: "seller_application",
      subjectId: application.id,
      reason: text,
      details: { userId: application.userId, shopName: application.shopName },
    });
    const person = await applicant(tx, application.userId);
    if (!person.email) return [];
    return [
      await enqueueMail(tx, {
        template: sellerDeclinedMail,
        to: person.email,
        props: { applicantName: person.name ?? person.email, shopName: application.shopName, reason: text, applicationUrl: `${env().APP_URL}/account/become-a-seller` },
      }),
    ];
  });
  await dispatchMail(mailIds);
}
