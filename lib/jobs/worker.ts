// The background worker: `node --import ./lib/jobs/register-hooks.mjs lib/jobs/worker.ts`.
// Started by `npm start` and the browser tests beside the app; in production run one or more of them
// next to the app instances. pg-boss hands each job to exactly one worker.
import "server-only";
import PgBoss from "pg-boss";
import { env } from "@/lib/env";
import { closeDb } from "@/db/client";
import { pendingMailIds } from "@/lib/mail/outbox";
import { ensureQueues } from "./boss";
import { JOB_HANDLERS, SCHEDULES } from "./handlers";
import { QUEUES, RETRY, type QueueName } from "./queues";

const SWEEP_MS = 15_000;

// Connection failures: the database restarting, failing over or briefly unreachable.
const CONNECTION_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

function isConnectionLoss(reason: unknown): boolean {
  if (!(reason instanceof Error)) return false;
  const code = (reason as { code?: unknown }).code;
  if (typeof code === "string" && CONNECTION_CODES.has(code)) return true;
  return /Connection terminated|not queryable|timeout exceeded when trying to connect/i.test(reason.message);
}

// pg-boss 10 does not await its own complete()/fail() after a handler (src/manager.js, work()), so a
// database that goes away at that moment surfaces here. The job stays active until pg-boss expires and
// retries it (and mail is re-queued by the sweep below), so the worker carries on. Anything else is a
// bug: exit, and let the supervisor start a fresh worker.
process.on("unhandledRejection", (reason) => {
  if (isConnectionLoss(reason)) {
    console.error("[worker] lost the database while recording a job's outcome; it is retried later:", (reason as Error).message);
    return;
  }
  console.error("[worker] unhandled rejection:", reason);
  process.exit(1);
});

async function main() {
  const boss = new PgBoss({ connectionString: env().DATABASE_URL, max: 4 });
  boss.on("error", (error) => console.error("[worker]", error.message));
  await boss.start();
  await ensureQueues(boss);

  for (const [queue, handler] of Object.entries(JOB_HANDLERS) as [QueueName, (data: never) => Promise<unknown>][]) {
    await boss.work(queue, { batchSize: 1, pollingIntervalSeconds: 1 }, async (jobs) => {
      for (const job of jobs) await handler(job.data as never);
    });
  }
  for (const { queue, cron } of SCHEDULES) await boss.schedule(queue, cron, {}, RETRY);

  // Mail whose job was never queued (the app could not reach pg-boss) is picked up here.
  const sweep = setInterval(async () => {
    try {
      for (const outboxId of await pendingMailIds(SWEEP_MS)) {
        await boss.send(QUEUES.mailDeliver, { outboxId }, { ...RETRY, singletonKey: outboxId });
      }
    } catch (error) {
      console.error("[worker] sweep failed:", (error as Error).message);
    }
  }, SWEEP_MS);

  console.log("[worker] ready");
  const stop = async () => {
    clearInterval(sweep);
    await boss.stop({ graceful: true, timeout: 5_000 }).catch(() => {});
    await closeDb();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((error) => {
  console.error("[worker] could not start:", error);
  process.exit(1);
});
