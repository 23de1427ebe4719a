import "server-only";
import { UTApi, UTFile } from "uploadthing/server";
import { env } from "@/lib/env";

// The file store behind the uploadthing SDK, used from the server: read a file back, put cleaned
// files, delete. The token comes from env(); the SDK itself reads the UPLOADTHING_API_URL,
// UPLOADTHING_INGEST_URL, UPLOADTHING_UFS_HOST and UPLOADTHING_UFS_APP_ID_LOCATION overrides
// that point it at the local stand-in (unset in production, where it uses the hosted service).

let api: UTApi | undefined;

function utapi(): UTApi {
  api ??= new UTApi({ token: env().UPLOADTHING_TOKEN, logLevel: "Warning" });
  return api;
}

export class StoreError extends Error {
  constructor(message: string, options?: ErrorOptions) {
    super(message, options);
    this.name = "StoreError";
  }
}

export type StoredFile = { key: string; url: string };
export type FileToStore = { bytes: Uint8Array; name: string; contentType: string };

const DOWNLOAD_TIMEOUT_MS = 30_000;

/** The stored bytes at `url`, refusing more than `maxBytes` (whatever the store claims). */
export async function downloadStored(url: string, maxBytes: number): Promise<Uint8Array> {
  const response = await fetch(url, { signal: AbortSignal.timeout(DOWNLOAD_TIMEOUT_MS), redirect: "error" });
  if (!response.ok || !response.body) throw new StoreError(`the store answered ${response.status} for ${url}`);
  const reader = response.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw new StoreError(`the stored file is larger than ${maxBytes} bytes`);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** Stores every file or none: a partial success is deleted again before the error is thrown. */
export async function storeFiles(files: readonly FileToStore[]): Promise<StoredFile[]> {
  const results = await utapi().uploadFiles(
    files.map((f) => new UTFile([Buffer.from(f.bytes)], f.name, { type: f.contentType })),
  );
  const stored = results.flatMap((r) => (r.data ? [{ key: r.data.key, url: r.data.ufsUrl }] : []));
  const failed = results.find((r) => r.error);
  if (failed?.error || stored.length !== files.length) {
    await deleteStored(stored.map((s) => s.key)).catch(() => undefined);
    throw new StoreError(`storing files failed: ${failed?.error?.message ?? "no answer"}`);
  }
  return stored;
}

export async function deleteStored(keys: readonly string[]): Promise<void> {
  if (keys.length === 0) return;
  const result = await utapi().deleteFiles([...keys]);
  if (!result.success) throw new StoreError(`deleting ${keys.join(", ")} failed`);
}
