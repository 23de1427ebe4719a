import "server-only";
import { deleteUpload } from "@/db/queries/uploads";
import { deleteStored } from "./store";

/**
 * Removes one of the owner's uploads that nothing uses any more: the row first (the database
 * refuses while a listing still holds it), then the stored file and its thumbnail.
 * Returns false when the key is not the owner's.
 */
export async function discardUpload({ key, ownerId }: { key: string; ownerId: string }): Promise<boolean> {
  const row = await deleteUpload({ key, ownerId });
  if (!row) return false;
  await deleteStored(row.thumbKey ? [row.key, row.thumbKey] : [row.key]);
  return true;
}
