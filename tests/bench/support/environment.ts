// What the benchmarks start for themselves, like tests/run.ts does for the suites: a PostgreSQL
// cluster of their own, a migrated and seeded database, the production build in its own folder,
// the fakes and `next start`, each on the benchmark ports. Started on first need, stopped at the end.
import path from "node:path";
import { mkdirSync } from "node:fs";
import pg from "pg";
import { applyMigrations } from "../../../db/migrate";
import { seedDemo } from "../../../db/seed";
import { createDatabaseIfMissing, dropDatabase, startDatabase, withDatabase, type DatabaseServer } from "../../../db/server";
import { buildApp, startApp, type AppProcess } from "../../../fakes/app-process";
import { startFakes, type RunningFakes } from "../../../fakes/index";
import { appEnvironment, appUrl, fakeUrls, LOCAL_KEYS } from "../../../fakes/local-config";
import { ARTIFACTS_DIR, AUTH_SECRET, BENCH_DATA_DIR, BENCH_DATABASE, BENCH_DIST_DIR, BENCH_PORTS } from "./config";

export const log = (line: string) => console.log(`[bench] ${line}`);

export type BenchEnvironment = {
  /** the benchmark database */
  databaseUrl: string;
  /** the app's environment, for processes that run app modules against the benchmark database */
  appEnv: Record<string, string>;
  /** http://localhost:<port>: the browser-facing address (Next writes localhost into links) */
  baseUrl: string;
  /** a pool for the benchmarks' own reads and set-up writes (not the one under test) */
  pool: pg.Pool;
  ensureApp(): Promise<void>;
  resetDatabase(): Promise<void>;
  stop(): Promise<void>;
};

export async function startEnvironment({ freshCluster }: { freshCluster: boolean }): Promise<BenchEnvironment> {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  // The benchmarks never share a build folder with `npm start` or a test slot.
  process.env.FLUXYARD_DIST_DIR = BENCH_DIST_DIR;
  // An outside DATABASE_URL would point the benchmark at someone's data; ours is always our own cluster.
  const { DATABASE_URL: _ignored, ...ownEnv } = process.env;
  const server: DatabaseServer = await startDatabase(
    { dataDir: BENCH_DATA_DIR, port: BENCH_PORTS.db, database: "postgres", fresh: freshCluster, log },
    ownEnv,
  );
  const admin = withDatabase(server.url, "postgres");
  const databaseUrl = withDatabase(server.url, BENCH_DATABASE);
  let pool = new pg.Pool({ connectionString: databaseUrl, max: 4 });
  let fakes: RunningFakes | null = null;
  let app: AppProcess | null = null;
  let appStarting: Promise<void> | null = null;

  const prepareDatabase = async () => {
    await createDatabaseIfMissing(admin, BENCH_DATABASE);
    await applyMigrations(databaseUrl);
    await seedDemo(databaseUrl);
  };
  await prepareDatabase();

  const appEnv = appEnvironment({ ports: BENCH_PORTS, databaseUrl, authSecret: AUTH_SECRET });

  const ensureApp = () => {
    appStarting ??= (async () => {
      await buildApp(log, { logFile: path.join(ARTIFACTS_DIR, "next-build.log") });
      const urls = fakeUrls(BENCH_PORTS);
      fakes = await startFakes({
        host: "127.0.0.1",
        mail: { port: BENCH_PORTS.mail },
        payments: {
          port: BENCH_PORTS.payments,
          publicUrl: urls.payments,
          webhooks: [{ url: `${appUrl(BENCH_PORTS)}/api/webhooks/payments`, secret: LOCAL_KEYS.stripeWebhookSecret }],
        },
        uploads: { port: BENCH_PORTS.uploads, apiKey: LOCAL_KEYS.uploadsApiKey, appId: LOCAL_KEYS.uploadsAppId, storageDir: path.join(ARTIFACTS_DIR, "uploads") },
      });
      app = await startApp({ port: BENCH_PORTS.app, env: appEnv, log, logFile: path.join(ARTIFACTS_DIR, "app.log") });
    })();
    return appStarting;
  };

  return {
    databaseUrl,
    appEnv,
    baseUrl: appUrl(BENCH_PORTS),
    get pool() {
      return pool;
    },
    ensureApp,
    async resetDatabase() {
      await pool.end();
      // The app's pool reconnects on its next query; a running app must not hold the old database open.
      await dropDatabase(admin, BENCH_DATABASE);
      await prepareDatabase();
      pool = new pg.Pool({ connectionString: databaseUrl, max: 4 });
    },
    async stop() {
      const running = app as AppProcess | null;
      const runningFakes = fakes as RunningFakes | null;
      await running?.stop().catch((e: unknown) => console.error(e));
      await runningFakes?.close().catch((e: unknown) => console.error(e));
      await pool.end().catch(() => {});
      await server.stop();
    },
  };
}
