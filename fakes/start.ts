// `npm start`: the whole product on its embedded defaults — PostgreSQL, migrations, the demo seed,
// the local fakes and a production build of the app. Ctrl-C or SIGTERM stops everything it started.
import path from "node:path";
import { startDatabase, redact } from "../db/server";
import { applyMigrations } from "../db/migrate";
import { seedDemo } from "../db/seed";
import { DEMO_ACCOUNTS } from "../db/seed-data";
import { parseEnv } from "../lib/env";
import { startFakes } from "./index";
import { appEnvironment, appUrl, DEV_PORTS, fakeUrls, LOCAL_KEYS, localAuthSecret } from "./local-config";
import { buildApp, startApp, type AppProcess } from "./app-process";
import { startWorker } from "./worker-process";
import { ensureDemoPayoutAccounts } from "./demo-payouts";
import { ensureDemoPayments } from "./demo-payments";

const root = path.resolve(import.meta.dirname, "..");
const dataDir = path.join(root, ".data");
const log = (line: string) => console.log(`[fluxyard] ${line}`);

async function main() {
  const ports = DEV_PORTS;
  const stops: (() => Promise<void>)[] = [];
  let stopping = false;
  const stopAll = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log("stopping …");
    for (const stop of stops.reverse()) await stop().catch((e) => console.error(e));
    log("stopped");
    process.exit(code);
  };
  process.on("SIGINT", () => void stopAll(0));
  process.on("SIGTERM", () => void stopAll(0));

  try {
    const database = await startDatabase({ dataDir: path.join(dataDir, "pg"), port: ports.db, database: "fluxyard", log });
    stops.push(database.stop);
    log(`database ${redact(database.url)}${database.external ? " (from DATABASE_URL)" : ""}`);
    await applyMigrations(database.url);
    const seeded = await seedDemo(database.url, { everyState: true });
    log(seeded.created ? "demo data seeded" : "demo data already present");

    const urls = fakeUrls(ports);
    const env = appEnvironment({ ports, databaseUrl: database.url, authSecret: localAuthSecret(dataDir) });
    parseEnv(env); // stop here, naming the variable, rather than fail inside the app

    const fakes = await startFakes({
      host: "127.0.0.1",
      mail: { port: ports.mail, storeFile: path.join(dataDir, "outbox.json") },
      payments: {
        port: ports.payments,
        publicUrl: urls.payments,
        webhooks: [{ url: `${appUrl(ports)}/api/webhooks/payments`, secret: LOCAL_KEYS.stripeWebhookSecret }],
        storeFile: path.join(dataDir, "payments.json"),
      },
      uploads: {
        port: ports.uploads,
        apiKey: LOCAL_KEYS.uploadsApiKey,
        appId: LOCAL_KEYS.uploadsAppId,
        storageDir: path.join(dataDir, "uploads"),
      },
    });
    stops.push(fakes.close);
    await ensureDemoPayoutAccounts({ databaseUrl: database.url, paymentsUrl: urls.payments, secretKey: LOCAL_KEYS.stripeSecret });
    await ensureDemoPayments({ databaseUrl: database.url, paymentsUrl: urls.payments, secretKey: LOCAL_KEYS.stripeSecret, log });

    await buildApp(log);
    const worker = await startWorker({ env, log });
    stops.push(worker.stop);
    const app: AppProcess = await startApp({ port: ports.app, env, log });
    stops.push(app.stop);
    app.child.on("exit", (code) => {
      if (!stopping) {
        log(`the app exited unexpectedly (code ${code})`);
        void stopAll(1);
      }
    });

    printBanner(appUrl(ports), urls);
  } catch (error) {
    console.error(`\n[fluxyard] could not start: ${error instanceof Error ? error.message : String(error)}`);
    await stopAll(1);
  }
}

function printBanner(app: string, urls: ReturnType<typeof fakeUrls>) {
  const lines = [
    "",
    "Fluxyard is running.",
    `  app              ${app}`,
    `  mail outbox      ${urls.mail}        (sign-in links and every e-mail the app sends)`,
    `  payments fake    ${urls.payments}`,
    `  uploads fake     ${urls.uploads}`,
    "",
    "Demo accounts (sign in at /sign-in with the address, then open the link in the outbox):",
    ...DEMO_ACCOUNTS.map((a) => `  ${a.email.padEnd(34)} ${a.roles.join(", ")}`),
    "",
    "Mains and charged capacitors can kill. Local electrical codes and licensed practice take precedence.",
    "Press Ctrl-C to stop everything.",
    "",
  ];
  console.log(lines.join("\n"));
}

void main();
