import "server-only";
import { deliverMail } from "@/lib/mail/outbox";
import type { JobPayloads, QueueName } from "./queues";

type Handler<Q extends QueueName> = (data: JobPayloads[Q]) => Promise<unknown>;

/** What the worker does for each queue. A handler that throws is retried with back-off by pg-boss. */
export const JOB_HANDLERS: { [Q in QueueName]?: Handler<Q> } = {
  "mail-deliver": async ({ outboxId }) => deliverMail(outboxId),
};

/** Scheduled jobs (cron, UTC). */
export const SCHEDULES: { queue: QueueName; cron: string }[] = [];
