// The outbox: every message the app sent, kept in memory and, when a file is given, on disk so a
// restart of the local stack still shows the magic link that was sent a minute ago.
import { randomUUID } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { dirname } from "node:path";

export type MailTag = { name: string; value: string };

export type OutgoingMessage = {
  from: string;
  to: string[];
  cc: string[];
  bcc: string[];
  replyTo: string[];
  subject: string;
  html: string | null;
  text: string | null;
  headers: Record<string, string>;
  tags: MailTag[];
  scheduledAt: string | null;
  attachments: { filename: string | null; contentType: string | null }[];
};

export type StoredMessage = OutgoingMessage & {
  id: string;
  createdAt: string;
  /** the Idempotency-Key the sender gave, so a test can tell a retry from a second send */
  idempotencyKey: string | null;
};

export type MessageStore = {
  add(message: OutgoingMessage, idempotencyKey?: string | null): StoredMessage;
  /** Newest first; `to` matches a bare address case-insensitively, with or without a display name. */
  list(filter?: { to?: string }): StoredMessage[];
  get(id: string): StoredMessage | undefined;
  clear(): void;
};

export function bareAddress(address: string): string {
  const named = /<\s*([^<>\s]+)\s*>\s*$/.exec(address);
  return (named?.[1] ?? address).trim().toLowerCase();
}

function load(storeFile: string): StoredMessage[] {
  if (!existsSync(storeFile)) return [];
  try {
    const parsed = JSON.parse(readFileSync(storeFile, "utf8")) as unknown;
    return Array.isArray(parsed) ? (parsed as StoredMessage[]) : [];
  } catch (error) {
    // A half-written or hand-edited file must not stop the local stack from starting.
    console.warn(`[mail fake] ignoring unreadable outbox file ${storeFile}:`, error);
    return [];
  }
}

export function createMessageStore(storeFile?: string): MessageStore {
  // Oldest first, so insertion order breaks ties between messages sent in the same millisecond.
  const messages: StoredMessage[] = storeFile ? load(storeFile) : [];

  const persist = () => {
    if (!storeFile) return;
    mkdirSync(dirname(storeFile), { recursive: true });
    const temporary = `${storeFile}.${process.pid}.tmp`;
    writeFileSync(temporary, JSON.stringify(messages, null, 2));
    renameSync(temporary, storeFile);
  };

  return {
    add(message, idempotencyKey = null) {
      const stored: StoredMessage = { ...message, id: randomUUID(), createdAt: new Date().toISOString(), idempotencyKey };
      messages.push(stored);
      persist();
      return stored;
    },
    list(filter = {}) {
      const wanted = filter.to ? bareAddress(filter.to) : undefined;
      const newestFirst = [...messages].reverse();
      if (!wanted) return newestFirst;
      return newestFirst.filter((m) => [...m.to, ...m.cc, ...m.bcc].some((a) => bareAddress(a) === wanted));
    },
    get(id) {
      return messages.find((m) => m.id === id);
    },
    clear() {
      messages.length = 0;
      persist();
    },
  };
}
