// Vitest global setup for the integration project: reuses the cluster that tests/run.ts started,
// or starts the test cluster itself when vitest is run on its own.
import path from "node:path";
import { applyMigrations } from "../../db/migrate";
import { createDatabaseIfMissing, dropDatabase, startDatabase, withDatabase } from "../../db/server";
import { TEST_PORTS } from "../../fakes/local-config";

export default async function setup() {
  if (process.env.TEST_PG_ADMIN_URL) return;
  const root = path.resolve(import.meta.dirname, "../..");
  const server = await startDatabase(
    // Its own cluster, so a vitest run beside `npm test` never shares one with it.
    // (An even port: test slots use odd ones above TEST_PORTS.db.)
    { dataDir: path.join(root, ".data", "pg-standalone"), port: TEST_PORTS.db - 1, database: "postgres" },
  );
  const admin = withDatabase(server.url, "postgres");
  // Each standalone run has its own template, so runs side by side never drop each other's.
  const template = `fluxyard_template_${process.pid}`;
  await dropDatabase(admin, template);
  await createDatabaseIfMissing(admin, template);
  await applyMigrations(withDatabase(admin, template));
  process.env.TEST_PG_ADMIN_URL = admin;
  process.env.TEST_PG_TEMPLATE = template;
  return async () => {
    await dropDatabase(admin, template).catch(() => {});
  };
}
