import "server-only";
import { insertUpload, type NewUpload } from "@/db/queries/uploads";
import { cleanPhoto, UnreadablePhotoError } from "./clean-photo";
import { inspectUpload, safeFileName } from "./inspect";
import { UPLOAD_ROUTES, type UploadRouteName } from "./limits";
import { deleteStored, downloadStored, storeFiles } from "./store";

// What happens to a file once the store has it (the route's onUploadComplete): read it back,
// judge its bytes, keep a cleaned copy or the original, record it, and answer the browser.
// Every refusal deletes what was stored and records nothing; the answer is data, never a throw,
// because a throwing onUploadComplete leaves the browser's upload hanging until it times out.

export type UploadServerData =
  | {
      ok: true;
      /** The key to submit with a form: the cleaned photo's, or the stored PDF's / capture's. */
      key: string;
      url: string;
      thumbUrl: string | null;
      width: number | null;
      height: number | null;
      name: string;
      bytes: number;
    }
  | { ok: false; message: string };

export type UploadedFile = { key: string; name: string; size: number; type: string; url: string };

const TRY_AGAIN = "could not be saved just now. Please try again in a moment.";

async function discard(keys: string[]): Promise<void> {
  try {
    await deleteStored(keys);
  } catch (error) {
    console.error(`[uploads] could not delete ${keys.join(", ")} from the store`, error);
  }
}

async function reject(file: UploadedFile, message: string): Promise<UploadServerData> {
  await discard([file.key]);
  return { ok: false, message };
}

function stem(name: string): string {
  return name.replace(/\.[^.]*$/, "") || "photo";
}

export async function processUploadedFile({
  route,
  file,
  ownerId,
}: {
  route: UploadRouteName;
  file: UploadedFile;
  ownerId: string;
}): Promise<UploadServerData> {
  const rule = UPLOAD_ROUTES[route];
  const name = safeFileName(file.name);
  try {
    let bytes: Uint8Array;
    try {
      bytes = await downloadStored(file.url, rule.maxBytes);
    } catch (error) {
      console.error(`[uploads] could not read back ${file.key}`, error);
      return await reject(file, `${name} ${TRY_AGAIN}`);
    }

    const inspection = inspectUpload(rule.purpose, bytes, name);
    if (!inspection.ok) return await reject(file, inspection.message);

    const base: Omit<NewUpload, "key" | "url" | "contentType" | "bytes"> = { ownerId, purpose: rule.purpose, originalName: name };

    if (inspection.kind !== "photo") {
      const contentType = inspection.kind === "pdf" ? "application/pdf" : file.type || "application/octet-stream";
      try {
        await insertUpload({ ...base, key: file.key, url: file.url, contentType, bytes: bytes.length });
      } catch (error) {
        console.error(`[uploads] could not record ${file.key}`, error);
        return await reject(file, `${name} ${TRY_AGAIN}`);
      }
      return { ok: true, key: file.key, url: file.url, thumbUrl: null, width: null, height: null, name, bytes: bytes.length };
    }

    let cleaned;
    try {
      cleaned = await cleanPhoto(bytes, inspection.content);
    } catch (error) {
      if (error instanceof UnreadablePhotoError) return await reject(file, `${name} was not accepted: ${error.reason}.`);
      throw error;
    }
    const { photo, thumb } = cleaned;
    const [storedPhoto, storedThumb] = await storeFiles([
      { bytes: photo.bytes, name: `${stem(name)}.${photo.extension}`, contentType: photo.contentType },
      { bytes: thumb.bytes, name: `${stem(name)}-thumb.${thumb.extension}`, contentType: thumb.contentType },
    ]);
    if (!storedPhoto || !storedThumb) throw new Error("the store returned fewer files than it was given");
    const copies = [storedPhoto.key, storedThumb.key];

    // The original still carries its metadata: it goes before anything is recorded.
    try {
      await deleteStored([file.key]);
    } catch (error) {
      console.error(`[uploads] could not delete the original ${file.key}`, error);
      await discard(copies);
      return { ok: false, message: `${name} ${TRY_AGAIN}` };
    }
    try {
      await insertUpload({
        ...base,
        key: storedPhoto.key,
        url: storedPhoto.url,
        contentType: photo.contentType,
        bytes: photo.bytes.length,
        thumbKey: storedThumb.key,
        thumbUrl: storedThumb.url,
        width: photo.width,
        height: photo.height,
      });
    } catch (error) {
      console.error(`[uploads] could not record ${storedPhoto.key}`, error);
      await discard(copies);
      return { ok: false, message: `${name} ${TRY_AGAIN}` };
    }
    return {
      ok: true,
      key: storedPhoto.key,
      url: storedPhoto.url,
      thumbUrl: storedThumb.url,
      width: photo.width,
      height: photo.height,
      name,
      bytes: photo.bytes.length,
    };
  } catch (error) {
    console.error(`[uploads] unexpected failure while processing ${file.key}`, error);
    return await reject(file, `${name} ${TRY_AGAIN}`);
  }
}
