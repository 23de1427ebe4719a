// Uploaded files on disk: <key>.bin holds the bytes, <key>.json what the upload said about them,
// <key>.part an upload still arriving (its length is the resume offset the HEAD reports).
import { createHash } from "node:crypto";
import { closeSync, existsSync, mkdirSync, openSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync, writeSync } from "node:fs";
import { join } from "node:path";

export type StoredFile = {
  key: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  acl: "public-read" | "private";
  contentDisposition: "inline" | "attachment";
  fileHash: string;
  uploadedAt: number;
  slug: string | null;
};

// Keys come from the SDK's alphabet; anything else must never reach a file path.
const SAFE_KEY = /^[A-Za-z0-9][A-Za-z0-9_.-]{0,199}$/;

export function isSafeKey(key: string): boolean {
  return SAFE_KEY.test(key) && !key.includes("..");
}

export type PartWriter = { write(chunk: Buffer): void; close(): void };

export function createFileStore(storageDir: string) {
  mkdirSync(storageDir, { recursive: true });
  const pathOf = (key: string, suffix: "bin" | "json" | "part") => {
    if (!isSafeKey(key)) throw new Error(`unsafe file key ${JSON.stringify(key)}`);
    return join(storageDir, `${key}.${suffix}`);
  };

  const get = (key: string): StoredFile | undefined => {
    if (!isSafeKey(key)) return undefined;
    const meta = pathOf(key, "json");
    if (!existsSync(meta) || !existsSync(pathOf(key, "bin"))) return undefined;
    return JSON.parse(readFileSync(meta, "utf8")) as StoredFile;
  };

  return {
    partialSize(key: string): number {
      const part = pathOf(key, "part");
      return existsSync(part) ? statSync(part).size : 0;
    },
    /** Appends from `offset`, which must equal what is already on disk (0 starts afresh). */
    openPart(key: string, offset: number): PartWriter {
      const fd = openSync(pathOf(key, "part"), offset === 0 ? "w" : "a");
      return {
        write: (chunk) => void writeSync(fd, chunk),
        close: () => closeSync(fd),
      };
    },
    discardPart(key: string): void {
      rmSync(pathOf(key, "part"), { force: true });
    },
    /** Moves a finished part into place and records it; the hash is MD5 hex, as the SDK's fileHash. */
    commit(key: string, info: Omit<StoredFile, "key" | "fileHash" | "uploadedAt">): StoredFile {
      const bytes = readFileSync(pathOf(key, "part"));
      const stored: StoredFile = {
        ...info,
        key,
        size: bytes.length,
        fileHash: createHash("md5").update(bytes).digest("hex"),
        uploadedAt: Date.now(),
      };
      renameSync(pathOf(key, "part"), pathOf(key, "bin"));
      writeFileSync(pathOf(key, "json"), JSON.stringify(stored, null, 2));
      return stored;
    },
    get,
    bytesPath(key: string): string {
      return pathOf(key, "bin");
    },
    update(key: string, change: Partial<Pick<StoredFile, "name" | "acl">>): boolean {
      const current = get(key);
      if (!current) return false;
      writeFileSync(pathOf(key, "json"), JSON.stringify({ ...current, ...change }, null, 2));
      return true;
    },
    remove(key: string): boolean {
      const existed = get(key) !== undefined;
      for (const suffix of ["bin", "json", "part"] as const) rmSync(pathOf(key, suffix), { force: true });
      return existed;
    },
    /** Oldest first. */
    list(): StoredFile[] {
      return readdirSync(storageDir)
        .filter((name) => name.endsWith(".json"))
        .map((name) => get(name.slice(0, -".json".length)))
        .filter((file): file is StoredFile => file !== undefined)
        .sort((a, b) => a.uploadedAt - b.uploadedAt);
    },
  };
}

export type FileStore = ReturnType<typeof createFileStore>;
