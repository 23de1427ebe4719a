// One database per test file, seeded with the demo accounts; app modules are imported after
// DATABASE_URL points at it.
import pg from "pg";
import { seedDemo } from "../../../db/seed";
import { freshDatabase } from "../../support/test-database";
import { connectFixtures, ensureSellerProfile, type FixtureDb } from "./fixtures";

export type ModerationTestDb = {
  url: string;
  fx: FixtureDb;
  pool: pg.Pool;
  teardown(): Promise<void>;
};

export async function setupModerationDb(label: string): Promise<ModerationTestDb> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  const fixtures = connectFixtures(database.url);
  const pool = new pg.Pool({ connectionString: database.url, max: 2 });
  // Dropping the database at the end cuts connections that are still closing; that is expected.
  pool.on("error", () => {});
  await ensureSellerProfile(fixtures.db, "demo-seller-kits", "Oyelaran Boards");
  await ensureSellerProfile(fixtures.db, "demo-seller-magnetics", "Kaszuba Windings");
  return {
    url: database.url,
    fx: fixtures.db,
    pool,
    teardown: async () => {
      // Transitions queue their e-mails through pg-boss; stop its sender so the run can end.
      const cache = (globalThis as { __fluxyardBoss?: { boss?: Promise<{ stop(o: object): Promise<void> }> } }).__fluxyardBoss;
      const boss = await cache?.boss?.catch(() => undefined);
      if (cache) cache.boss = undefined;
      await boss?.stop({ graceful: false, close: true }).catch(() => {});
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await fixtures.close();
      await pool.end();
      await database.drop();
    },
  };
}

/** The session user the guards would hand over, read from the database like getSessionUser does. */
export async function sessionUser(id: string) {
  const { getUserWithRoles } = await import("@/db/queries/users");
  const user = await getUserWithRoles(id);
  if (!user) throw new Error(`no user ${id}`);
  return user;
}

export async function outboxTo(pool: pg.Pool, to: string): Promise<{ template: string; props: Record<string, unknown> }[]> {
  const { rows } = await pool.query("select template, props from mail_outbox where \"to\" = $1 order by created_at", [to]);
  return rows;
}

export async function auditFor(pool: pg.Pool, subjectId: string): Promise<{ actor_id: string | null; action: string; reason: string | null; details: Record<string, unknown> }[]> {
  const { rows } = await pool.query("select actor_id, action, reason, details from audit_log where subject_id = $1 order by id", [subjectId]);
  return rows;
}
