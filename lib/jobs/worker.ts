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
