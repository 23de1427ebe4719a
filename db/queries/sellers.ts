import "server-only";
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db/client";
import { auditLog, sellerApplications, sellerProfiles, users, type SellerApplication, type SellerProfile } from "@/db/schema";
import { env } from "@/lib/env";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import { slugify, type ShopFields } from "@/lib/validations/sellers";
import { sellerApplicationReceivedMail } from "@/emails/sellers/seller-application-received";

export class SellerError extends Error {
  constructor(
    readonly status: 404 | 409,
    message: string,
    /** the form field the message belongs to, when it is about one */
    readonly field?: keyof ShopFields,
  ) {
    super(message);
    this.name = "SellerError";
  }
}

export async function getSellerProfile(userId: string, executor: Executor = db): Promise<SellerProfile | null> {
  const [profile] = await executor.select().from(sellerProfiles).where(eq(sellerProfiles.userId, userId));
  return profile ?? null;
}

export async function latestApplication(userId: string, executor: Executor = db): Promise<SellerApplication | null> {
  const [row] = await executor
    .select()
    .from(sellerApplications)
    .where(eq(sellerApplications.userId, userId))
    .orderBy(desc(sellerApplications.createdAt))
    .limit(1);
  return row ?? null;
}

async function shopNameTaken(tx: Executor, shopName: string, exceptUserId?: string): Promise<boolean> {
  const [row] = await tx
    .select({ userId: sellerProfiles.userId })
    .from(sellerProfiles)
    .where(sql`lower(${sellerProfiles.shopName}) = lower(${shopName})`);
  return row !== undefined && row.userId !== exceptUserId;
}

/**
 * A member's application to sell. One pending application at a time: the person's row is locked
 * so two quick submissions cannot both pass the check.
 */
export async function createApplication(userId: string, fields: ShopFields): Promise<SellerApplication> {
  const { application, mailIds } = await db.transaction(async (tx) => {
    const [person] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, userId)).for("update");
    if (!person) throw new SellerError(404, "No such person.");
    if (await getSellerProfile(userId, tx)) throw new SellerError(409, "You already have a shop; manage it from the seller desk.");
    const [pending] = await tx
      .select({ id: sellerApplications.id })
      .from(sellerApplications)
      .where(and(eq(sellerApplications.userId, userId), eq(sellerApplications.status, "pending")));
    if (pending) throw new SellerError(409, "You already have an application waiting for a moderator; you will hear by e-mail.");
    if (await shopNameTaken(tx, fields.shopName)) throw new SellerError(409, "Another shop already has that name; choose another.", "shopName");

    const [application] = await tx.insert(sellerApplications).values({ userId, ...fields }).returning();
    if (!application) throw new Error("insert returned no row");
    await tx.insert(auditLog).values({
      actorId: userId,
      action: "seller_application.submitted",
      subjectType: "seller_application",
      subjectId: application.id,
      details: { shopName: fields.shopName, country: fields.country },
    });
    const mailIds: string[] = [];
    if (person.email) {
      mailIds.push(
        await enqueueMail(tx, {
          template: sellerApplicationReceivedMail,
          to: person.email,
          props: { applicantName: person.name ?? person.email, shopName: fields.shopName, statusUrl: `${env().APP_URL}/account/become-a-seller` },
        }),
      );
    }
    return { application, mailIds };
  });
  await dispatchMail(mailIds);
  return application;
}

/**
 * Opens a shop inside the caller's transaction: used when a moderator approves an application,
 * and when a person who was given the seller role directly fills in their shop. The slug gets a
 * number when another shop already has it.
 */
export async function createSellerProfileInTx(tx: Tx, userId: string, fields: ShopFields): Promise<SellerProfile> {
  if (await shopNameTaken(tx, fields.shopName, userId)) throw new SellerError(409, "Another shop already has that name; choose another.", "shopName");
  const base = slugify(fields.shopName);
  const taken = await tx
    .select({ slug: sellerProfiles.slug })
    .from(sellerProfiles)
    .where(sql`${sellerProfiles.slug} = ${base} or ${sellerProfiles.slug} like ${`${base}-%`}`);
  const used = new Set(taken.map((r) => r.slug));
  let slug = base;
  for (let n = 2; used.has(slug); n++) slug = `${base}-${n}`;
  const [profile] = await tx
    .insert(sellerProfiles)
    .values({ userId, slug, ...fields })
    .onConflictDoNothing({ target: sellerProfiles.userId })
    .returning();
  if (!profile) throw new SellerError(409, "This person already has a shop.");
  return profile;
}

/** For a seller whose role was granted directly and who has no shop yet. */
export async function openShopForSeller(userId: string, fields: ShopFields): Promise<SellerProfile> {
  return db.transaction(async (tx) => {
    const profile = await createSellerProfileInTx(tx, userId, fields);
    await tx.insert(auditLog).values({
      actorId: userId,
      action: "seller_profile.created",
      subjectType: "seller_profile",
      subjectId: userId,
      details: { shopName: fields.shopName, country: fields.country },
    });
    return profile;
  });
}

/**
 * Records the connected account the first time; a second click (or a race) keeps the first one,
 * so a seller never ends up with two accounts at the provider linked to one shop.
 */
export async function attachPayoutAccount(userId: string, accountId: string): Promise<string> {
  const [updated] = await db
    .update(sellerProfiles)
    .set({ payoutAccountId: accountId, updatedAt: new Date() })
    .where(and(eq(sellerProfiles.userId, userId), isNull(sellerProfiles.payoutAccountId)))
    .returning({ id: sellerProfiles.payoutAccountId });
  if (updated?.id) return updated.id;
  const profile = await getSellerProfile(userId);
  if (!profile?.payoutAccountId) throw new SellerError(404, "Open your shop before connecting a payout account.");
  return profile.payoutAccountId;
}

export async function recordPayoutStatus(
  userId: string,
  accountId: string,
  status: { chargesEnabled: boolean; payoutsEnabled: boolean },
): Promise<void> {
  await db
    .update(sellerProfiles)
    .set({ ...status, updatedAt: new Date() })
    .where(and(eq(sellerProfiles.userId, userId), eq(sellerProfiles.payoutAccountId, accountId)));
}
