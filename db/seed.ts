// Idempotent demo seed: every row has a fixed key and is inserted only when missing,
// so running it twice changes nothing. `npm run db:seed` or called by the launcher.
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { DEMO_ACCOUNTS } from "./seed-data";

export async function seedDemo(connectionString: string): Promise<{ created: boolean }> {
  const pool = new pg.Pool({ connectionString, max: 2 });
  const db = drizzle(pool, { schema });
  try {
    return await db.transaction(async (tx) => {
      const inserted = await tx
        .insert(schema.users)
        .values(
          DEMO_ACCOUNTS.map((a) => ({
            id: a.id,
            email: a.email,
            name: a.name,
            emailVerified: new Date("2026-09-01T09:00:00Z"),
            createdAt: new Date("2026-09-01T09:00:00Z"),
          })),
        )
        .onConflictDoNothing()
        .returning({ id: schema.users.id });
      await tx
        .insert(schema.userRoles)
        .values(DEMO_ACCOUNTS.flatMap((a) => a.roles.map((role) => ({ userId: a.id, role, grantedAt: new Date("2026-09-01T09:00:00Z") }))))
        .onConflictDoNothing();
      return { created: inserted.length > 0 };
    });
  } finally {
    await pool.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("Set DATABASE_URL to the database to seed (npm start seeds its embedded database itself).");
    process.exit(1);
  }
  seedDemo(url)
    .then((r) => console.log(r.created ? "demo data seeded" : "demo data already present"))
    .catch((error) => {
      console.error(error);
      process.exit(1);
    });
}
