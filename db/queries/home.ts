import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { userRoles, users } from "@/db/schema";

/** People who sell on Fluxyard, for the start page. */
export async function listSellers(limit = 6) {
  return db
    .select({ id: users.id, name: users.name })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(eq(userRoles.role, "seller"))
    .orderBy(asc(users.name))
    .limit(limit);
}
