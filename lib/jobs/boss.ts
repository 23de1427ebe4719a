import "server-only";
import PgBoss from "pg-boss";
import { env } from "@/lib/env";
import { QUEUES, RETRY, type JobPayloads, type QueueName } from "./queues";

type Cache = { boss?: Promise<PgBoss> };
const cache: Cache = ((globalThis as { __fluxyardBoss?: Cache }).__fluxyardBoss ??= {});

/** The app's handle for sending jobs; it runs no workers and no maintenance (the worker process does). */
export function jobSender(): Promise<PgBoss> {
  cache.boss ??= (async () => {
    const boss = new PgBoss({ connectionString: env().DATABASE_URL, supervise: false, schedule: false, max: 2 });
    boss.on("error", (error) => console.error("[jobs]", error.message));
    await boss.start();
    await ensureQueues(boss);
    return boss;
  })().catch((error) => {
    cache.boss = undefined;
    throw error;
  });
  return cache.boss;
}

export async function ensureQueues(boss: PgBoss): Promise<void> {
  for (const name of Object.values(QUEUES)) {
    if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, ...RETRY });
  }
}

/**
 * Sends a job after the change it belongs to has committed. A failure here is logged, not thrown:
 * whatever the job would do is also recorded in the database and picked up by the worker's sweep.
 */
export async function sendJob<Q extends QueueName>(name: Q, data: JobPayloads[Q], options: PgBoss.SendOptions = {}): Promise<void> {
  try {
    const boss = await jobSender();
    await boss.send(name, data, { ...RETRY, ...options });
  } catch (error) {
    console.error(`[jobs] could not queue ${name}; the worker's sweep will pick it up:`, (error as Error).message);
  }
}
