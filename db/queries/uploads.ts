import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import { uploads, type Upload } from "@/db/schema";
import type { UploadPurpose } from "@/lib/uploads/limits";

export type NewUpload = typeof uploads.$inferInsert;

export async function insertUpload(row: NewUpload, executor: Executor = db): Promise<Upload> {
  const [inserted] = await executor.insert(uploads).values(row).returning();
  if (!inserted) throw new Error(`inserting upload ${row.key} returned no row`);
  return inserted;
}

/**
 * The caller's own uploads among `keys` (optionally of one purpose), so a form can attach only
 * files its sender uploaded. Keys that are someone else's, or unknown, are simply absent.
 */
export async function uploadsOwnedBy(
  ownerId: string,
  keys: readonly string[],
  { purpose, executor = db }: { purpose?: UploadPurpose; executor?: Executor } = {},
): Promise<Upload[]> {
  if (keys.length === 0) return [];
  return executor
    .select()
    .from(uploads)
    .where(and(eq(uploads.ownerId, ownerId), inArray(uploads.key, [...keys]), purpose ? eq(uploads.purpose, purpose) : undefined));
}

/**
 * Deletes the row if it is the owner's and returns it (so the caller can delete the stored file
 * and thumbnail), or null. A photo or document still attached to a listing is kept by the
 * database's foreign keys (ON DELETE RESTRICT): that raises an error.
 */
export async function deleteUpload({ key, ownerId }: { key: string; ownerId: string }, executor: Executor = db): Promise<Upload | null> {
  const [deleted] = await executor
    .delete(uploads)
    .where(and(eq(uploads.key, key), eq(uploads.ownerId, ownerId)))
    .returning();
  return deleted ?? null;
}
