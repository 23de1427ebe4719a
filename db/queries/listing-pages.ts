import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { answers, listings, orderLines, questions, stockReservations } from "@/db/schema";

// The slugs that name the cached listing pages a change touches (lib/listings/listing-pages.ts).

export async function slugsOfListings(listingIds: readonly string[]): Promise<string[]> {
  if (listingIds.length === 0) return [];
  const rows = await db
    .select({ slug: listings.slug })
    .from(listings)
    .where(inArray(listings.id, [...listingIds]));
  return rows.map((r) => r.slug);
}

/** The listings a checkout reserved stock of. */
export async function slugsOfCheckout(checkoutId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ slug: listings.slug })
    .from(stockReservations)
    .innerJoin(listings, eq(listings.id, stockReservations.listingId))
    .where(eq(stockReservations.checkoutId, checkoutId));
  return rows.map((r) => r.slug);
}

export async function slugsOfOrder(orderId: string): Promise<string[]> {
  const rows = await db.selectDistinct({ slug: listings.slug }).from(orderLines).innerJoin(listings, eq(listings.id, orderLines.listingId)).where(eq(orderLines.orderId, orderId));
  return rows.map((r) => r.slug);
}

/** The listing a question is about; none for a question about the general bench. */
export async function slugOfQuestion(questionId: string): Promise<string[]> {
  const rows = await db.select({ slug: listings.slug }).from(questions).innerJoin(listings, eq(listings.id, questions.listingId)).where(eq(questions.id, questionId));
  return rows.map((r) => r.slug);
}

export async function slugOfAnswer(answerId: string): Promise<string[]> {
  const rows = await db
    .select({ slug: listings.slug })
    .from(answers)
    .innerJoin(questions, eq(questions.id, answers.questionId))
    .innerJoin(listings, eq(listings.id, questions.listingId))
    .where(eq(answers.id, answerId));
  return rows.map((r) => r.slug);
}
