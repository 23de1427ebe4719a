import { MAIL_URL } from "./browser";

export type OutboxMessage = { id: string; to: string[]; subject: string; html: string; text: string; createdAt: string };

export async function messagesTo(address: string): Promise<OutboxMessage[]> {
  const res = await fetch(`${MAIL_URL}/api/messages`);
  if (!res.ok) throw new Error(`outbox answered ${res.status}`);
  const all = (await res.json()) as OutboxMessage[];
  return all.filter((m) => m.to.some((t) => t.toLowerCase().includes(address.toLowerCase())));
}

/**
 * Waits for the newest message to an address that arrived after `since` — with `subject`, the newest
 * whose subject matches, since other mail to the same person (a sign-in link, an earlier notice
 * the worker delivers late) can arrive in between.
 */
export async function waitForMessage(address: string, since: Date, timeoutMs = 15_000, subject?: string | RegExp): Promise<OutboxMessage> {
  const deadline = Date.now() + timeoutMs;
  const matches = (m: OutboxMessage) =>
    subject === undefined || (typeof subject === "string" ? m.subject.includes(subject) : subject.test(m.subject));
  while (Date.now() < deadline) {
    const found = (await messagesTo(address)).find((m) => new Date(m.createdAt) >= since && matches(m));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no message to ${address}${subject ? ` matching ${String(subject)}` : ""} arrived within ${timeoutMs / 1000} s`);
}

export function firstLink(message: OutboxMessage, contains: string): string {
  const links = [...message.html.matchAll(/href="([^"]+)"/g)].map((m) => m[1]!.replaceAll("&amp;", "&"));
  const link = links.find((l) => l.includes(contains));
  if (!link) throw new Error(`no link containing ${contains} in "${message.subject}"`);
  return link;
}
