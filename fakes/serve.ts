// `tsx fakes/serve.ts`: only the local fakes, for working on the app with `next dev`.
// Ports and keys come from the environment, with the defaults of `npm start`.
import path from "node:path";
import { startFakes } from "./index";

const root = path.resolve(import.meta.dirname, "..");
const env = process.env;
const port = (name: string, fallback: number) => {
  const value = Number(env[name] ?? fallback);
  if (!Number.isInteger(value) || value < 0 || value > 65535) throw new Error(`${name} must be a port number, got ${env[name]}`);
  return value;
};

async function main() {
  const host = env.FAKES_HOST ?? "127.0.0.1";
  const appUrl = (env.APP_URL ?? "http://localhost:3000").replace(/\/$/, "");
  const paymentsPort = port("PAYMENTS_FAKE_PORT", 4020);
  const fakes = await startFakes({
    host,
    mail: {
      port: port("MAIL_FAKE_PORT", 4010),
      apiKey: env.MAIL_FAKE_API_KEY,
      storeFile: env.MAIL_FAKE_STORE_FILE ?? path.join(root, ".data", "outbox.json"),
    },
    payments: {
      port: paymentsPort,
      publicUrl: env.PAYMENTS_FAKE_PUBLIC_URL ?? `http://${host}:${paymentsPort}`,
      webhooks: [
        {
          url: env.PAYMENTS_FAKE_WEBHOOK_URL ?? `${appUrl}/api/webhooks/payments`,
          secret: env.PAYMENTS_FAKE_WEBHOOK_SECRET ?? env.STRIPE_WEBHOOK_SECRET ?? "whsec_local_fake_secret",
        },
      ],
    },
    uploads: {
      port: port("UPLOADS_FAKE_PORT", 4030),
      apiKey: env.UPLOADS_FAKE_API_KEY ?? "sk_local_uploads_fake",
      appId: env.UPLOADS_FAKE_APP_ID ?? "fluxyard-local",
      storageDir: env.UPLOADS_FAKE_STORAGE_DIR ?? path.join(root, ".data", "uploads"),
    },
  });

  console.log(
    [
      "Local fakes are running:",
      `  mail outbox     ${fakes.urls.mail}`,
      `  payments        ${fakes.urls.payments}`,
      `  uploads         ${fakes.urls.uploads}`,
      "Press Ctrl-C to stop.",
    ].join("\n"),
  );

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal}: stopping the fakes …`);
    fakes.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

main().catch((error: unknown) => {
  console.error(`could not start the fakes: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
