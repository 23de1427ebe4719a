import "server-only";
import { getPool } from "@/db/client";

/** true when PostgreSQL answers a trivial query within the timeout. */
export async function databaseIsUp(timeoutMs = 3_000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const probe = getPool()
    .query("select 1")
    .then(() => true)
    .catch(() => false);
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
