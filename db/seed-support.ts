// What the demo seed's parts share: the transaction type, fixed ids, the scenario's clock and the
// audit entry every seeded change writes beside it (as the product writes one beside each change).
import { createHash } from "node:crypto";
import type { drizzle } from "drizzle-orm/node-postgres";
import * as schema from "./schema";

export type SeedTx = Parameters<Parameters<ReturnType<typeof drizzle<typeof schema>>["transaction"]>[0]>[0];

/** When the base demo (accounts, shops, the first listings) was set up. */
export const SEEDED_AT = new Date("2026-09-01T09:00:00Z");

/**
 * A fixed UUID per demo row (name-based, in the manner of RFC 9562 version 5: SHA-1 of a name,
 * version and variant bits set), so a second run finds every row it would write already there.
 */
export function demoUuid(area: string, n: number): string {
  const hex = createHash("sha1").update(`fluxyard-demo:${area}:${n}`).digest("hex");
  const variant = ((parseInt(hex[16]!, 16) & 0x3) | 0x8).toString(16);
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${variant}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/**
 * The scenario's clock. Everything whose meaning depends on the time (a review request still inside
 * its 48 hours, a grace period still running, a checkout still held) is placed relative to the
 * moment of the first seeding; the rows are written once, so later runs keep those moments.
 */
export type DemoClock = { now: Date; ago(days: number, hours?: number): Date; ahead(days: number, hours?: number): Date };

export function demoClock(now: Date): DemoClock {
  return {
    now,
    ago: (days, hours = 0) => new Date(now.getTime() - days * DAY_MS - hours * HOUR_MS),
    ahead: (days, hours = 0) => new Date(now.getTime() + days * DAY_MS + hours * HOUR_MS),
  };
}

export type SeedAudit = {
  at: Date;
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  reason?: string | null;
  details?: Record<string, unknown>;
};

/** One audit entry; `seeded: true` marks the demo's own history apart from what people do in the demo. */
export async function seedAudit(tx: SeedTx, entries: SeedAudit[]): Promise<void> {
  if (entries.length === 0) return;
  await tx.insert(schema.auditLog).values(
    entries.map((e) => ({
      at: e.at,
      actorId: e.actorId,
      action: e.action,
      subjectType: e.subjectType,
      subjectId: e.subjectId,
      reason: e.reason ?? null,
      details: { ...(e.details ?? {}), seeded: true },
    })),
  );
}
