import "server-only";
import { lt, sql } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import { rateLimits } from "@/db/schema";

/**
 * Counts one hit in the current fixed window of `key` and returns the window's count after it.
 * One statement: the upsert takes the row's lock, so concurrent hits from any number of app
 * instances are counted one after another and no two see the same count. The window starts at a
 * multiple of `windowSeconds` since the epoch on the database's clock (one clock for every instance).
 */
export async function countHit(
  { key, windowSeconds, at }: { key: string; windowSeconds: number; at?: Date },
  executor: Executor = db,
): Promise<{ count: number; windowStart: Date }> {
  const moment = at ? sql`${at.toISOString()}::timestamptz` : sql`now()`;
  const windowStart = sql`to_timestamp(floor(extract(epoch from ${moment}) / ${windowSeconds}) * ${windowSeconds})`;
  const result = await executor.execute<{ count: number; window_start: Date | string }>(sql`
    insert into ${rateLimits} (key, window_start, count)
    values (${key}, ${windowStart}, 1)
    on conflict (key, window_start) do update set count = ${rateLimits}.count + 1
    returning count, window_start
  `);
  const row = result.rows[0];
  if (!row) throw new Error(`counting a hit for ${key} returned no row`);
  return { count: Number(row.count), windowStart: new Date(row.window_start) };
}

/** Drops windows that ended before `before`; they can no longer refuse anything. */
export async function pruneRateLimits(before: Date, executor: Executor = db): Promise<number> {
  const deleted = await executor.delete(rateLimits).where(lt(rateLimits.windowStart, before)).returning({ key: rateLimits.key });
  return deleted.length;
}
