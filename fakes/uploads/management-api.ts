// The UTApi management calls (POST {apiUrl}/v6/…), answered in the shapes the SDK decodes with
// its response schemas (uploadthing/server, class UTApi).
import type { FileStore, StoredFile } from "./file-store";
import { signUrl } from "./signing";

export type ManagementContext = {
  files: FileStore;
  apiKey: string;
  appId: string;
  publicUrl: string;
};

type Answer = { status: number; body: unknown };

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

function strings(value: unknown): string[] {
  return Array.isArray(value) ? value.filter((v): v is string => typeof v === "string") : [];
}

export function fileUrls(publicUrl: string, appId: string, key: string) {
  const fileUrl = `${publicUrl}/f/${encodeURIComponent(key)}`;
  return { url: fileUrl, ufsUrl: fileUrl, appUrl: `${publicUrl}/a/${encodeURIComponent(appId)}/${encodeURIComponent(key)}` };
}

/** Picks files by fileKeys or by customIds, as each call allows either. */
function select(files: FileStore, body: Record<string, unknown>): StoredFile[] {
  const all = files.list();
  if (body.customIds !== undefined) {
    const ids = new Set(strings(body.customIds));
    return all.filter((f) => f.customId !== null && ids.has(f.customId));
  }
  const keys = new Set(strings(body.fileKeys));
  return all.filter((f) => keys.has(f.key));
}

function findOne(files: FileStore, ref: Record<string, unknown>): StoredFile | undefined {
  if (typeof ref.fileKey === "string") return files.get(ref.fileKey);
  if (typeof ref.customId === "string") return files.list().find((f) => f.customId === ref.customId);
  return undefined;
}

export function handleManagementCall(path: string, body: unknown, context: ManagementContext): Answer {
  const { files, publicUrl, appId, apiKey } = context;
  const input = isRecord(body) ? body : {};

  switch (path) {
    case "/v6/listFiles": {
      const all = files.list();
      const offset = typeof input.offset === "number" ? Math.max(0, input.offset) : 0;
      const limit = typeof input.limit === "number" ? Math.max(0, input.limit) : 500;
      const page = all.slice(offset, offset + limit);
      return {
        status: 200,
        body: {
          hasMore: offset + page.length < all.length,
          files: page.map((f) => ({
            id: f.key,
            customId: f.customId,
            key: f.key,
            name: f.name,
            size: f.size,
            status: "Uploaded",
            uploadedAt: f.uploadedAt,
          })),
        },
      };
    }
    case "/v6/deleteFiles": {
      const chosen = select(files, input);
      for (const file of chosen) files.remove(file.key);
      return { status: 200, body: { success: true, deletedCount: chosen.length } };
    }
    case "/v6/getFileUrl":
      return {
        status: 200,
        body: { data: select(files, input).map((f) => ({ key: f.key, url: fileUrls(publicUrl, appId, f.key).ufsUrl })) },
      };
    case "/v6/requestFileAccess": {
      const file = findOne(files, input);
      if (!file) return { status: 404, body: { error: "file not found" } };
      const ttl = typeof input.expiresIn === "number" && input.expiresIn > 0 ? input.expiresIn : 3600;
      const signed = signUrl(fileUrls(publicUrl, appId, file.key).ufsUrl, apiKey, ttl);
      return { status: 200, body: { url: signed, ufsUrl: signed } };
    }
    case "/v6/renameFiles": {
      const updates = Array.isArray(input.updates) ? input.updates.filter(isRecord) : [];
      for (const update of updates) {
        const file = findOne(files, update);
        if (file && typeof update.newName === "string") files.update(file.key, { name: update.newName });
      }
      return { status: 200, body: { success: true } };
    }
    case "/v6/updateACL": {
      const updates = Array.isArray(input.updates) ? input.updates.filter(isRecord) : [];
      for (const update of updates) {
        const file = findOne(files, update);
        if (file && (update.acl === "public-read" || update.acl === "private")) files.update(file.key, { acl: update.acl });
      }
      return { status: 200, body: { success: true } };
    }
    case "/v6/getUsageInfo": {
      const all = files.list();
      const totalBytes = all.reduce((sum, f) => sum + f.size, 0);
      return {
        status: 200,
        body: { totalBytes, appTotalBytes: totalBytes, filesUploaded: all.length, limitBytes: 2 * 1024 ** 3 },
      };
    }
    default:
      return { status: 404, body: { error: `${path} is not offered by the local uploads fake` } };
  }
}
