// `npm test`: one PostgreSQL cluster for the run, then unit + integration tests (while the production
// build runs beside them), then browser tests in Chromium against that build with the fakes.
// The last line printed is `N passed, N failed`; any failure gives a non-zero exit.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { applyMigrations } from "../db/migrate";
import { seedDemo } from "../db/seed";
import { createDatabaseIfMissing, dropDatabase, startDatabase, withDatabase } from "../db/server";
import { startFakes } from "../fakes/index";
import { appEnvironment, appUrl, fakeUrls, LOCAL_KEYS, testPorts } from "../fakes/local-config";
import { buildApp, startApp } from "../fakes/app-process";
import { failureLines, type VitestReport } from "./support/vitest-report";
import { startWorker } from "../fakes/worker-process";

// `npm test -- --e2e-only tests/e2e/x.test.ts …` skips the unit and integration suites and runs only those
// browser tests; FLUXYARD_TEST_SLOT=N gives a run its own ports, cluster and build folder.
const cliArgs = process.argv.slice(2);
const e2eOnly = cliArgs.includes("--e2e-only");
const e2eFiles = cliArgs.filter((a) => !a.startsWith("--"));
const slot = Number(process.env.FLUXYARD_TEST_SLOT ?? 0);
const ports = testPorts(slot);
if (slot > 0) process.env.FLUXYARD_DIST_DIR = `.next-slot${slot}`;

const root = path.resolve(import.meta.dirname, "..");
const artifacts = path.join(root, "tests", slot > 0 ? `.artifacts-slot${slot}` : ".artifacts");
const log = (line: string) => console.log(`[test] ${line}`);
const TEMPLATE = "fluxyard_template";

type Counts = { passed: number; failed: number; skipped: number; failures?: string[] };

async function main(): Promise<number> {
  const started = Date.now();
  rmSync(artifacts, { recursive: true, force: true });
  mkdirSync(artifacts, { recursive: true });
  ensureChromium();

  const server = await startDatabase({ dataDir: path.join(root, ".data", slot > 0 ? `pg-test-slot${slot}` : "pg-test"), port: ports.db, database: "postgres", fresh: true, log });
  const admin = withDatabase(server.url, "postgres");
  const stops: (() => Promise<void>)[] = [server.stop];
  const counts: Counts = { passed: 0, failed: 0, skipped: 0 };
  try {
    await dropDatabase(admin, TEMPLATE);
    await createDatabaseIfMissing(admin, TEMPLATE);
    await applyMigrations(withDatabase(admin, TEMPLATE));
    const testEnv = { TEST_PG_ADMIN_URL: admin, TEST_PG_TEMPLATE: TEMPLATE };

    log(e2eOnly ? "building for the browser tests" : "unit and integration tests, with the production build beside them");
    const buildLog = path.join(artifacts, "next-build.log");
    const [fast, build] = await Promise.allSettled([
      e2eOnly ? Promise.resolve({ passed: 0, failed: 0, skipped: 0 }) : runVitest(["unit", "integration"], testEnv, "vitest-fast.json"),
      buildApp(log, { logFile: buildLog }),
    ]);
    add(counts, fast.status === "fulfilled" ? fast.value : { passed: 0, failed: 1, skipped: 0 });
    if (build.status === "rejected") {
      console.error(String(build.reason));
      counts.failed += 1;
      return finish(counts, started);
    }

    const e2eDb = "fluxyard_e2e";
    await dropDatabase(admin, e2eDb);
    await createDatabaseIfMissing(admin, e2eDb, TEMPLATE);
    const e2eUrl = withDatabase(admin, e2eDb);
    await seedDemo(e2eUrl, { everyState: true });

    const urls = fakeUrls(ports);
    const fakes = await startFakes({
      host: "127.0.0.1",
      mail: { port: ports.mail },
      payments: {
        port: ports.payments,
        publicUrl: urls.payments,
        webhooks: [{ url: `${appUrl(ports)}/api/webhooks/payments`, secret: LOCAL_KEYS.stripeWebhookSecret }],
      },
      uploads: { port: ports.uploads, apiKey: LOCAL_KEYS.uploadsApiKey, appId: LOCAL_KEYS.uploadsAppId, storageDir: path.join(artifacts, "uploads") },
    });
    stops.push(fakes.close);
    const env = appEnvironment({ ports, databaseUrl: e2eUrl, authSecret: "test-secret-for-the-browser-suite-only-0123456789" });
    const worker = await startWorker({ env, log, logFile: path.join(artifacts, "worker.log") });
    stops.push(worker.stop);
    const app = await startApp({ port: ports.app, env, log, logFile: path.join(artifacts, "app.log") });
    stops.push(app.stop);

    log("browser tests in Chromium");
    add(
      counts,
      await runVitest(["e2e"], {
        ...testEnv,
        E2E_BASE_URL: appUrl(ports),
        E2E_DATABASE_URL: e2eUrl,
        E2E_MAIL_URL: urls.mail,
        E2E_PAYMENTS_URL: urls.payments,
        E2E_UPLOADS_URL: urls.uploads,
        E2E_ARTIFACTS: artifacts,
      }, "vitest-e2e.json", e2eFiles),
    );
  } catch (error) {
    console.error(error);
    counts.failed += 1;
  } finally {
    for (const stop of stops.reverse()) await stop().catch((e) => console.error(e));
  }
  return finish(counts, started);
}

function add(total: Counts, part: Counts) {
  total.passed += part.passed;
  total.failed += part.failed;
  total.skipped += part.skipped;
  if (part.failures?.length) total.failures = [...(total.failures ?? []), ...part.failures];
}

function finish(counts: Counts, started: number): number {
  log(`finished in ${Math.round((Date.now() - started) / 1000)} s`);
  // The failures again, so that the last lines of a long log say what broke.
  for (const failure of counts.failures ?? []) console.log(`[test] FAILED ${failure}`);
  console.log(`${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ""}`);
  return counts.failed > 0 || counts.passed === 0 ? 1 : 0;
}

async function runVitest(projects: string[], extraEnv: Record<string, string>, reportName: string, files: string[] = []): Promise<Counts> {
  const report = path.join(artifacts, reportName);
  const vitest = path.join(root, "node_modules", "vitest", "vitest.mjs");
  const args = [vitest, "run", ...files, ...projects.flatMap((p) => ["--project", p]), "--passWithNoTests", "--reporter=default", "--reporter=json", `--outputFile.json=${report}`];
  const child = spawn(process.execPath, args, { cwd: root, stdio: "inherit", env: { ...process.env, ...extraEnv, NODE_ENV: "test" } });
  const code = await new Promise<number>((resolve) => child.on("exit", (c) => resolve(c ?? 1)));
  if (!existsSync(report)) return { passed: 0, failed: 1, skipped: 0 };
  const json = JSON.parse(readFileSync(report, "utf8")) as VitestReport;
  const failed = json.numFailedTests + (code !== 0 && json.numFailedTests === 0 ? Math.max(1, json.numFailedTestSuites) : 0);
  return { passed: json.numPassedTests, failed, skipped: json.numPendingTests + json.numTodoTests, failures: failureLines(json, root) };
}


function ensureChromium() {
  if (existsSync("/usr/bin/chromium")) return;
  if (process.getuid?.() !== 0) {
    throw new Error("Chromium is missing for the browser tests: install Debian's package with `sudo apt-get install -y chromium`");
  }
  log("installing Debian's chromium for the browser tests (apt-get) …");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (const args of [["update", "-qq"], ["install", "-y", "-qq", "chromium"]]) {
    const result = spawnSync("apt-get", args, { stdio: "inherit", env });
    if (result.status !== 0) throw new Error(`apt-get ${args.join(" ")} failed`);
  }
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(error);
    console.log("0 passed, 1 failed");
    process.exit(1);
  },
);
