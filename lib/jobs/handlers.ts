import "server-only";
import { deliverMail } from "@/lib/mail/outbox";
import { sweepCheckouts } from "@/lib/payments/checkout";
import { enforceGracePeriods, recheckLiveListings } from "@/lib/moderation/recheck";
import { settlePendingRefunds } from "@/db/queries/orders";
import { expireOverdueReviews } from "@/lib/reviews/sweep";
import { runCaptureMeasureJob, sweepStrandedCaptures } from "@/lib/captures/jobs";
import type { JobPayloads, QueueName } from "./queues";

type Handler<Q extends QueueName> = (data: JobPayloads[Q]) => Promise<unknown>;

/** What the worker does for each queue. A handler that throws is retried with back-off by pg-boss. */
export const JOB_HANDLERS: { [Q in QueueName]?: Handler<Q> } = {
  "mail-deliver": async ({ outboxId }) => deliverMail(outboxId),
  "checkout-sweep": async () => sweepCheckouts(),
  "policy-recheck": async ({ revision }) => recheckLiveListings(revision),
  "policy-enforce-grace": async () => enforceGracePeriods(),
  "refunds-settle": async () => settlePendingRefunds(),
  "reviews-expire": async () => expireOverdueReviews(new Date()),
  "capture-measure": async ({ captureId }) => runCaptureMeasureJob(captureId),
  "captures-sweep": async () => sweepStrandedCaptures(),
};

/** Scheduled jobs (cron, UTC). */
export const SCHEDULES: { queue: QueueName; cron: string }[] = [
  // Grace periods end at any time of day; ten minutes late is close enough.
  { queue: "policy-enforce-grace", cron: "*/10 * * * *" },
  // Holds whose expiry event never came, and transfers or refunds that failed: every minute.
  { queue: "checkout-sweep", cron: "* * * * *" },
  // Refunds the payment provider did not answer are asked again with the same idempotency key.
  { queue: "refunds-settle", cron: "*/5 * * * *" },
  // Review requests past 48 h expire and their holds are released; undisputed reports close after 7 days.
  { queue: "reviews-expire", cron: "*/5 * * * *" },
  // Captures whose measuring job was never queued, or whose worker stopped: every minute.
  { queue: "captures-sweep", cron: "* * * * *" },
];
