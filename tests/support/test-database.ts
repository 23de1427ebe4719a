// Each integration test file gets its own database, copied from a migrated template on the test cluster.
import { randomBytes } from "node:crypto";
import { createDatabaseIfMissing, dropDatabase, withDatabase } from "../../db/server";

export function testServerUrl(database: string): string {
  const admin = process.env.TEST_PG_ADMIN_URL;
  if (!admin) throw new Error("TEST_PG_ADMIN_URL is not set: run the tests with `npm test` (or vitest, whose global setup starts the test cluster)");
  return withDatabase(admin, database);
}

/** A new database with every migration applied; dropped by the returned function. */
export async function freshDatabase(label: string): Promise<{ url: string; drop(): Promise<void> }> {
  const template = process.env.TEST_PG_TEMPLATE ?? "fluxyard_template";
  const name = `t_${label.replace(/[^a-z0-9]+/gi, "_").toLowerCase()}_${randomBytes(3).toString("hex")}`;
  const admin = testServerUrl("postgres");
  for (let attempt = 0; ; attempt++) {
    try {
      await createDatabaseIfMissing(admin, name, template);
      break;
    } catch (error) {
      // Two copies of one template at the same instant can collide; a short wait settles it.
      if (attempt >= 5) throw error;
      await new Promise((r) => setTimeout(r, 200 * (attempt + 1)));
    }
  }
  return { url: testServerUrl(name), drop: () => dropDatabase(admin, name) };
}
