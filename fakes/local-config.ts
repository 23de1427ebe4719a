// Addresses and settings of a local run: `npm start` (DEV) and `npm test` (TEST) use different ports,
// so both can run on one machine at the same time.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { uploadthingEnv } from "./uploads/env";

export type LocalPorts = { app: number; mail: number; payments: number; uploads: number; db: number };

export const DEV_PORTS: LocalPorts = { app: 3000, mail: 4010, payments: 4020, uploads: 4030, db: 54329 };
export const TEST_PORTS: LocalPorts = { app: 3100, mail: 4110, payments: 4120, uploads: 4130, db: 54339 };

/** Ports of a parallel test slot (FLUXYARD_TEST_SLOT=N), so several developers' runs can share a machine. */
export function testPorts(slot: number): LocalPorts {
  if (slot === 0) return TEST_PORTS;
  return { app: 3100 + slot * 10, mail: 4110 + slot * 100, payments: 4120 + slot * 100, uploads: 4130 + slot * 100, db: 54339 + slot * 2 };
}

export const LOCAL_KEYS = {
  resend: "re_local_fake_key",
  stripeSecret: "sk_test_local_fake_key",
  stripeWebhookSecret: "whsec_local_fake_secret",
  uploadsApiKey: "sk_local_uploads_fake",
  uploadsAppId: "fluxyard-local",
};

/** The browser-facing base URL: Next rewrites 127.0.0.1 to localhost in links, so use localhost throughout. */
export function appUrl(ports: LocalPorts): string {
  return `http://localhost:${ports.app}`;
}

export function fakeUrls(ports: LocalPorts) {
  return {
    mail: `http://127.0.0.1:${ports.mail}`,
    payments: `http://127.0.0.1:${ports.payments}`,
    uploads: `http://127.0.0.1:${ports.uploads}`,
  };
}

/** A secret kept in the git-ignored data folder, so sessions survive a restart of `npm start`. */
export function localAuthSecret(dataDir: string): string {
  const file = path.join(dataDir, "auth-secret");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

export function appEnvironment({
  ports,
  databaseUrl,
  authSecret,
}: {
  ports: LocalPorts;
  databaseUrl: string;
  authSecret: string;
}): Record<string, string> {
  const fakes = fakeUrls(ports);
  const base = appUrl(ports);
  return {
    NODE_ENV: "production",
    DATABASE_URL: databaseUrl,
    APP_URL: base,
    AUTH_URL: base,
    AUTH_SECRET: authSecret,
    AUTH_TRUST_HOST: "true",
    MAIL_FROM: "Fluxyard <no-reply@fluxyard.test>",
    RESEND_API_KEY: LOCAL_KEYS.resend,
    RESEND_BASE_URL: fakes.mail,
    MAIL_OUTBOX_URL: fakes.mail,
    STRIPE_SECRET_KEY: LOCAL_KEYS.stripeSecret,
    STRIPE_WEBHOOK_SECRET: LOCAL_KEYS.stripeWebhookSecret,
    STRIPE_API_URL: fakes.payments,
    UPLOADS_PUBLIC_ORIGIN: fakes.uploads,
    ...uploadthingEnv({
      fakeUrl: fakes.uploads,
      apiKey: LOCAL_KEYS.uploadsApiKey,
      appId: LOCAL_KEYS.uploadsAppId,
      callbackUrl: `${base}/api/uploadthing`,
    }),
  };
}
