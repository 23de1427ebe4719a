import "server-only";
import { and, asc, eq, ilike, or, sql } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import { auditLog, userRoles, users, type Role } from "@/db/schema";

export async function getUserWithRoles(userId: string, executor: Executor = db) {
  const rows = await executor
    .select({ id: users.id, email: users.email, name: users.name, role: userRoles.role })
    .from(users)
    .leftJoin(userRoles, eq(userRoles.userId, users.id))
    .where(eq(users.id, userId));
  const first = rows[0];
  if (!first) return null;
  const roles = rows.map((r) => r.role).filter((r): r is Role => r !== null);
  return { id: first.id, email: first.email, name: first.name, roles };
}

export type UserListRow = { id: string; email: string | null; name: string | null; createdAt: Date; roles: Role[] };

export async function listUsers({ search, limit = 200 }: { search?: string; limit?: number }): Promise<UserListRow[]> {
  const term = search?.trim();
  const rows = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      createdAt: users.createdAt,
      roles: sql<Role[]>`coalesce(array_agg(${userRoles.role}::text order by ${userRoles.role}) filter (where ${userRoles.role} is not null), '{}')`,
    })
    .from(users)
    .leftJoin(userRoles, eq(userRoles.userId, users.id))
    .where(term ? or(ilike(users.email, `%${term}%`), ilike(users.name, `%${term}%`)) : undefined)
    .groupBy(users.id)
    .orderBy(asc(users.email))
    .limit(limit);
  return rows;
}

/** Grants or revokes a role and records it in the audit log, in one transaction. */
export async function changeRole({
  actorId,
  userId,
  role,
  grant,
}: {
  actorId: string;
  userId: string;
  role: Role;
  grant: boolean;
}): Promise<{ changed: boolean }> {
  return db.transaction(async (tx) => {
    const target = await tx.select({ id: users.id }).from(users).where(eq(users.id, userId));
    if (target.length === 0) throw new NotFoundError("No such user.");
    const result = grant
      ? await tx.insert(userRoles).values({ userId, role, grantedBy: actorId }).onConflictDoNothing().returning({ role: userRoles.role })
      : await tx
          .delete(userRoles)
          .where(and(eq(userRoles.userId, userId), eq(userRoles.role, role)))
          .returning({ role: userRoles.role });
    const changed = result.length > 0;
    if (changed) {
      await tx.insert(auditLog).values({
        actorId,
        action: grant ? "role.granted" : "role.revoked",
        subjectType: "user",
        subjectId: userId,
        details: { role },
      });
    }
    return { changed };
  });
}

export class NotFoundError extends Error {
  readonly status = 404;
}
