// Background job names and their payloads; the worker (lib/jobs/worker.ts) handles each.
export const QUEUES = {
  mailDeliver: "mail-deliver",
  policyRecheck: "policy-recheck",
  policyEnforceGrace: "policy-enforce-grace",
  checkoutSweep: "checkout-sweep",
  refundsSettle: "refunds-settle",
  reviewsExpire: "reviews-expire",
  captureMeasure: "capture-measure",
  capturesSweep: "captures-sweep",
} as const;

export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

export type JobPayloads = {
  "mail-deliver": { outboxId: string };
  "policy-recheck": { revision: number };
  "policy-enforce-grace": Record<string, never>;
  "checkout-sweep": Record<string, never>;
  "refunds-settle": Record<string, never>;
  "reviews-expire": Record<string, never>;
  "capture-measure": { captureId: string };
  "captures-sweep": Record<string, never>;
};

/** Retries with exponential back-off: a provider outage of an hour or so loses nothing. */
export const RETRY = { retryLimit: 12, retryDelay: 5, retryBackoff: true } as const;
