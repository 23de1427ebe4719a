import "server-only";
import { and, asc, eq, lt, sql } from "drizzle-orm";
import { render } from "@react-email/render";
import { db, type Executor } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { env } from "@/lib/env";
import { mailTemplate, type MailTemplate } from "@/emails/registry";
import "@/emails/all";
import { mailClient } from "./client";
import { QUEUES } from "@/lib/jobs/queues";
import { sendJob } from "@/lib/jobs/boss";

/** Writes a message to the outbox inside the caller's transaction; returns its id. */
export async function enqueueMail<P>(
  executor: Executor,
  message: { template: { name: string; template: MailTemplate<P> }; to: string; props: P },
): Promise<string> {
  const [row] = await executor
    .insert(mailOutbox)
    .values({ template: message.template.name, to: message.to, props: message.props as Record<string, unknown> })
    .returning({ id: mailOutbox.id });
  return row!.id;
}

/** After commit: ask the worker to deliver now rather than at its next sweep. */
export async function dispatchMail(ids: string[]): Promise<void> {
  await Promise.all(ids.map((outboxId) => sendJob(QUEUES.mailDeliver, { outboxId }, { singletonKey: outboxId })));
}

export class MailDeliveryError extends Error {}

/**
 * Delivers one queued message. Idempotent: a sent message is skipped, and the outbox id is the
 * provider's idempotency key, so a crash between sending and recording never sends it twice.
 */
export async function deliverMail(outboxId: string): Promise<"sent" | "already-sent" | "missing"> {
  const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, outboxId));
  if (!row) return "missing";
  if (row.status === "sent") return "already-sent";
  const template = mailTemplate(row.template);
  if (!template) {
    await db.update(mailOutbox).set({ status: "failed", lastError: `unknown template ${row.template}` }).where(eq(mailOutbox.id, outboxId));
    return "missing";
  }
  const element = template.render(row.props);
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true })]);
  const { data, error } = await mailClient().emails.send(
    { from: env().MAIL_FROM, to: row.to, subject: template.subject(row.props), html, text },
    { idempotencyKey: row.id },
  );
  if (error || !data) {
    await db
      .update(mailOutbox)
      .set({ attempts: sql`${mailOutbox.attempts} + 1`, lastError: error?.message ?? "no answer" })
      .where(eq(mailOutbox.id, outboxId));
    throw new MailDeliveryError(`mail ${outboxId} not delivered: ${error?.message ?? "no answer"}`);
  }
  await db.update(mailOutbox).set({ status: "sent", sentAt: new Date(), providerId: data.id, attempts: sql`${mailOutbox.attempts} + 1` }).where(eq(mailOutbox.id, outboxId));
  return "sent";
}

/** Pending messages older than `olderThanMs`: the worker's sweep re-queues them. */
export async function pendingMailIds(olderThanMs: number, limit = 100): Promise<string[]> {
  const rows = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.status, "pending"), lt(mailOutbox.createdAt, new Date(Date.now() - olderThanMs))))
    .orderBy(asc(mailOutbox.createdAt))
    .limit(limit);
  return rows.map((r) => r.id);
}
