// A self-contained stack for one fault-test file: its own database, its own fakes on free ports,
// background workers and one or two `next start` processes of the already-built app. A test may stop
// any piece and start it again on the same port, which the shared stack of tests/run.ts cannot allow.
import { randomBytes, randomUUID } from "node:crypto";
import { mkdirSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import Stripe from "stripe";
import { applyMigrations } from "../../../db/migrate";
import { seedDemo } from "../../../db/seed";
import { createDatabaseIfMissing, dropDatabase, startDatabase, withDatabase, type DatabaseServer } from "../../../db/server";
import { startApp, type AppProcess } from "../../../fakes/app-process";
import { ensureDemoPayoutAccounts } from "../../../fakes/demo-payouts";
import { appEnvironment, LOCAL_KEYS, type LocalPorts } from "../../../fakes/local-config";
import { startMailFake, type MailFake } from "../../../fakes/mail/server";
import { startPaymentsFake, type PaymentsFake } from "../../../fakes/payments/server";
import { startUploadsFake, type UploadsFake } from "../../../fakes/uploads/server";
import { startWorker } from "../../../fakes/worker-process";

const root = path.resolve(import.meta.dirname, "../../..");
const HOST = "127.0.0.1";
const AUTH_SECRET = "fault-tests-secret-for-the-browser-suite-0123456789";
const SEEDED_TEMPLATE = "fluxyard_faults_seeded";

export type StackOptions = {
  label: string;
  /** `next start` processes of the same build against the one database */
  apps?: 1 | 2;
  workers?: 1 | 2;
  /** its own PostgreSQL cluster, which the test may restart; otherwise a database on the run's cluster */
  ownCluster?: boolean;
};

export type FaultStack = {
  label: string;
  databaseUrl: string;
  /** the test's own connections, for setting up and checking */
  db: pg.Pool;
  /** browser-facing base URLs (localhost, as Next writes them into links), one per app instance */
  appUrls: string[];
  apps: AppProcess[];
  workers: Worker[];
  mailUrl: string;
  paymentsUrl: string;
  stripe: Stripe;
  /** the restartable cluster, with `ownCluster` */
  database: DatabaseServer | null;
  artifacts: string;
  stopMail(): Promise<void>;
  startMail(): Promise<void>;
  stopPayments(): Promise<void>;
  startPayments(): Promise<void>;
  stop(): Promise<void>;
};

type Worker = Awaited<ReturnType<typeof startWorker>>;

const log = (line: string) => console.log(`[faults] ${line}`);

/** `count` distinct free ports: all are held until all are known, so none is handed out twice. */
export async function freePorts(count: number): Promise<number[]> {
  const servers = await Promise.all(
    Array.from(
      { length: count },
      () =>
        new Promise<net.Server>((resolve, reject) => {
          const server = net.createServer();
          server.once("error", reject);
          server.listen(0, HOST, () => resolve(server));
        }),
    ),
  );
  const ports = servers.map((server) => (server.address() as net.AddressInfo).port);
  await Promise.all(servers.map((server) => new Promise((resolve) => server.close(resolve))));
  return ports;
}

/** A database of the demo seed: copied from a seeded template made once per cluster (the seed is the slow part). */
async function seededDatabase(adminUrl: string, label: string): Promise<string> {
  const template = process.env.TEST_PG_TEMPLATE ?? "fluxyard_template";
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  let seeded: boolean;
  try {
    seeded = (await admin.query("select 1 from pg_database where datname = $1", [SEEDED_TEMPLATE])).rowCount === 1;
  } finally {
    await admin.end();
  }
  if (!seeded) {
    const building = `${SEEDED_TEMPLATE}_${randomBytes(3).toString("hex")}`;
    await createDatabaseIfMissing(adminUrl, building, template);
    await seedDemo(withDatabase(adminUrl, building));
    const rename = new pg.Client({ connectionString: adminUrl });
    await rename.connect();
    try {
      await rename.query(`alter database "${building}" rename to "${SEEDED_TEMPLATE}"`);
    } catch {
      // Another run made it first; ours is not needed.
      await dropDatabase(adminUrl, building);
    } finally {
      await rename.end();
    }
  }
  const name = `faults_${label.replace(/[^a-z0-9]+/gi, "_").toLowerCase()}_${randomBytes(3).toString("hex")}`;
  await createDatabaseIfMissing(adminUrl, name, SEEDED_TEMPLATE);
  return withDatabase(adminUrl, name);
}

export async function startStack(options: StackOptions): Promise<FaultStack> {
  const started = Date.now();
  const slot = Number(process.env.FLUXYARD_TEST_SLOT ?? 0);
  const artifacts = path.join(process.env.E2E_ARTIFACTS ?? path.join(os.tmpdir(), "fluxyard-e2e"), "faults", options.label);
  mkdirSync(artifacts, { recursive: true });
  const stops: (() => Promise<void>)[] = [];
  const stopAll = async () => {
    for (const stop of stops.splice(0).reverse()) await stop().catch((error) => console.error("[faults] stopping:", error));
  };

  try {
    let database: DatabaseServer | null = null;
    let databaseUrl: string;
    if (options.ownCluster) {
      database = await startDatabase(
        { dataDir: path.join(root, ".data", slot > 0 ? `pg-faults-slot${slot}` : "pg-faults"), port: (await freePorts(1))[0]!, database: "fluxyard", fresh: true, log },
        // Always its own server, even when DATABASE_URL names another: this one is restarted.
        { NODE_ENV: "test" },
      );
      stops.push(database.stop);
      databaseUrl = database.url;
      await applyMigrations(databaseUrl);
      await seedDemo(databaseUrl);
    } else {
      const admin = process.env.TEST_PG_ADMIN_URL;
      if (!admin) throw new Error("TEST_PG_ADMIN_URL is not set: run the fault tests through `npm test`");
      databaseUrl = await seededDatabase(admin, options.label);
      stops.push(() => dropDatabase(admin, new URL(databaseUrl).pathname.slice(1)));
    }
    const db = new pg.Pool({ connectionString: databaseUrl, max: 4 });
    // The test's own pool lives through a database restart too.
    db.on("error", () => {});
    stops.push(() => db.end());

    const [mailPort, paymentsPort, uploadsPort, ...appPorts] = await freePorts(3 + (options.apps ?? 1));
    const appUrls = appPorts.map((port) => `http://localhost:${port}`);
    const ports = { mail: mailPort!, payments: paymentsPort!, uploads: uploadsPort! };
    const mailStore = path.join(artifacts, "outbox.json");
    const paymentsStore = path.join(artifacts, "payments.json");

    let mail: MailFake | null = null;
    const startMail = async () => {
      mail = await startMailFake({ host: HOST, port: ports.mail, storeFile: mailStore });
    };
    const stopMail = async () => {
      await mail?.close();
      mail = null;
    };
    let payments: PaymentsFake | null = null;
    const startPayments = async () => {
      payments = await startPaymentsFake({
        host: HOST,
        port: ports.payments,
        publicUrl: `http://${HOST}:${ports.payments}`,
        storeFile: paymentsStore,
        // Every instance is an endpoint, as a load balancer would spread the provider's calls.
        webhooks: appUrls.map((url) => ({ url: `${url}/api/webhooks/payments`, secret: LOCAL_KEYS.stripeWebhookSecret })),
        log: () => {},
      });
    };
    const stopPayments = async () => {
      await payments?.close();
      payments = null;
    };
    await startMail();
    stops.push(stopMail);
    const uploads: UploadsFake = await startUploadsFake({ host: HOST, port: ports.uploads, apiKey: LOCAL_KEYS.uploadsApiKey, appId: LOCAL_KEYS.uploadsAppId, storageDir: path.join(artifacts, "uploads") });
    stops.push(() => uploads.close());
    const paymentsUrl = `http://${HOST}:${ports.payments}`;
    const mailUrl = `http://${HOST}:${ports.mail}`;

    const envFor = (appPort: number) => {
      const local: LocalPorts = { app: appPort, ...ports, db: 0 };
      return appEnvironment({ ports: local, databaseUrl, authSecret: AUTH_SECRET });
    };
    const workers: Worker[] = [];
    const apps: AppProcess[] = [];
    const launchWorker = async (i: number) => {
      const worker = await startWorker({ env: envFor(appPorts[0]!), log: () => {}, logFile: path.join(artifacts, `worker-${i + 1}.log`) });
      workers.push(worker);
      stops.push(worker.stop);
    };
    const launchApp = async (i: number) => {
      const app = await startApp({ port: appPorts[i]!, env: envFor(appPorts[i]!), log: () => {}, logFile: path.join(artifacts, `app-${i + 1}.log`) });
      apps[i] = app;
      stops.push(app.stop);
    };
    // The first worker creates pg-boss's tables; the others and the apps then start side by side.
    await launchWorker(0);
    const launches = await Promise.allSettled([
      ...Array.from({ length: (options.workers ?? 1) - 1 }, (_, i) => launchWorker(i + 1)),
      ...appPorts.map((_, i) => launchApp(i)),
    ]);
    const failed = launches.find((l) => l.status === "rejected");
    if (failed) throw (failed as PromiseRejectedResult).reason;
    // The provider starts once the apps listen: its events are delivered one at a time per endpoint, so
    // one sent to an app not yet up would hold up every later event behind its retries.
    await startPayments();
    stops.push(stopPayments);
    await ensureDemoPayoutAccounts({ databaseUrl, paymentsUrl, secretKey: LOCAL_KEYS.stripeSecret });
    stops.push(useStackInProcess(envFor(appPorts[0]!)));

    const stripe = new Stripe(LOCAL_KEYS.stripeSecret, { host: HOST, port: ports.payments, protocol: "http", maxNetworkRetries: 0 });
    log(`${options.label}: stack up in ${((Date.now() - started) / 1000).toFixed(1)} s (apps ${appUrls.join(", ")})`);
    return { label: options.label, databaseUrl, db, appUrls, apps, workers, mailUrl, paymentsUrl, stripe, database, artifacts, stopMail, startMail, stopPayments, startPayments, stop: stopAll };
  } catch (error) {
    await stopAll();
    throw error;
  }
}

/**
 * Points the app modules a test imports itself (to open a checkout as the checkout action does) at
 * this stack. lib/env reads the environment once, so this must run before the first such import.
 */
function useStackInProcess(appEnv: Record<string, string>): () => Promise<void> {
  const before = new Map<string, string | undefined>();
  for (const [key, value] of Object.entries(appEnv)) {
    if (key === "NODE_ENV") continue;
    before.set(key, process.env[key]);
    process.env[key] = value;
  }
  // Put back what was there, so a later test file in the same process sees the run's environment.
  return async () => {
    for (const [key, value] of before) {
      if (value === undefined) delete process.env[key];
      else process.env[key] = value;
    }
  };
}

// ——— people and things ———

/** A member with a database session, as Auth.js writes one at sign-in; returns the session token. */
export type Member = { userId: string; email: string; token: string };

export async function signedIn(stack: FaultStack, who: { id?: string; email: string }): Promise<Member> {
  const id = who.id ?? randomUUID();
  const { rows } = await stack.db.query<{ id: string }>(
    "insert into users (id, email, name, email_verified) values ($1, $2, $3, now()) on conflict (email) do update set email_verified = users.email_verified returning id",
    [id, who.email, who.email.split("@")[0]],
  );
  const userId = rows[0]!.id;
  await stack.db.query("insert into user_roles (user_id, role) values ($1, 'member') on conflict do nothing", [userId]);
  const token = randomBytes(32).toString("hex");
  await stack.db.query("insert into sessions (session_token, user_id, expires) values ($1, $2, now() + interval '1 day')", [token, userId]);
  return { userId, email: who.email, token };
}

// Auth.js names the cookie with a __Secure- prefix when the app is served over https; both are sent.
const SESSION_COOKIES = ["authjs.session-token", "__Secure-authjs.session-token"];

export function sessionCookieHeader(token: string): string {
  return SESSION_COOKIES.map((name) => `${name}=${token}`).join("; ");
}

export function browserSessionCookies(token: string) {
  return SESSION_COOKIES.map((name) => ({ name, value: token, domain: "localhost", path: "/", httpOnly: true, secure: name.startsWith("__Secure-"), sameSite: "Lax" as const }));
}

/** A live, low-voltage listing (no safety sheet to acknowledge) of an onboarded demo seller. */
export async function liveListing(stack: FaultStack, input: { sellerId?: string; stock: number; priceMinor: number; title: string }): Promise<{ id: string; slug: string; title: string }> {
  const id = randomUUID();
  const slug = `fault-${input.title.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${id.slice(0, 6)}`;
  const notes = [{ topic: "codes-and-competence", text: "This part sits on the isolated side; wiring it into a mains build still follows local electrical codes and licensed practice." }];
  await stack.db.query(
    `insert into listings (id, seller_id, kind, magnetic_subtype, title, slug, description_md, price_minor, currency, stock, declaration, safety_notes, sheet_revision, state, policy_revision, policy_status, live_at)
     values ($1, $2, 'magnetic', 'choke', $3, $4, 'An invented output choke for the fault tests.', $5, 'EUR', $6, $7, $8, 1, 'live',
             (select coalesce(max(revision), 1) from policy_revisions), 'clear', now())`,
    [id, input.sellerId ?? "demo-seller-magnetics", input.title, slug, input.priceMinor, input.stock, JSON.stringify({ mainsConnected: false, liveHeatsinks: false, weldingSource: false }), JSON.stringify(notes)],
  );
  return { id, slug, title: input.title };
}

/** Puts a listing in a member's cart through the app's own cart API. */
export async function addToCart(appUrl: string, token: string, listingId: string, quantity = 1): Promise<void> {
  const res = await fetch(`${appUrl}/api/cart`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie: sessionCookieHeader(token), origin: appUrl },
    body: JSON.stringify({ listingId, quantity }),
  });
  if (!res.ok) throw new Error(`POST /api/cart answered ${res.status}: ${await res.text()}`);
}

/**
 * Opens a checkout of the member's cart exactly as the checkout action does, with the app's own
 * startCheckout run in this process (see useStackInProcess); returns the provider's session id.
 */
export async function openCheckout(member: Member): Promise<{ checkoutId: string; sessionId: string }> {
  const { startCheckout } = await import("@/lib/payments/checkout");
  const result = await startCheckout({ id: member.userId, email: member.email }, { acknowledgements: {} });
  if (!result.ok) throw new Error(`checkout refused (${result.code}): ${result.message}`);
  const sessionId = /\/pay\/(cs_[A-Za-z0-9_]+)/.exec(result.url)?.[1];
  if (!sessionId) throw new Error(`no session id in ${result.url}`);
  return { checkoutId: result.checkoutId, sessionId };
}

/** Pays a hosted checkout session as a buyer on the provider's page would (the fake's test hook). */
export async function payAtProvider(stack: FaultStack, sessionId: string, card = "4242424242424242"): Promise<Response> {
  return fetch(`${stack.paymentsUrl}/api/test/pay`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ sessionId, card }) });
}

export async function paymentsHook(stack: FaultStack, hook: string, body: unknown): Promise<void> {
  const res = await fetch(`${stack.paymentsUrl}/api/test/${hook}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  if (!res.ok) throw new Error(`payments fake ${hook} answered ${res.status}: ${await res.text()}`);
}

export type FakeMessage = { id: string; to: string[]; subject: string; createdAt: string; idempotencyKey: string | null };

export async function fakeMessages(stack: FaultStack): Promise<FakeMessage[]> {
  const res = await fetch(`${stack.mailUrl}/api/messages`);
  if (!res.ok) throw new Error(`mail fake answered ${res.status}`);
  return (await res.json()) as FakeMessage[];
}

/**
 * Makes a race certain rather than likely: holds a row lock while `act` sets the contenders off, waits
 * until `waiters` of them are blocked on it inside their transactions, then lets them all go at once.
 */
export async function raceAtLock(stack: FaultStack, lockSql: string, params: unknown[], waiters: number, act: () => Promise<unknown>): Promise<void> {
  const lock = await stack.db.connect();
  lock.on("error", () => {});
  let acting: Promise<unknown> = Promise.resolve();
  try {
    await lock.query("begin");
    await lock.query(lockSql, params);
    // Not awaited yet: a click whose page waits on the lock may itself wait for that page.
    acting = act();
    await eventually(`${waiters} transactions waiting on the lock`, async () => {
      const { rows } = await stack.db.query("select count(*)::int as n from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()");
      return rows[0].n >= waiters;
    }, 20_000, 50).catch(async (error: Error) => {
      const { rows } = await stack.db.query("select state, wait_event_type, left(query, 120) as query from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()");
      const deliveries = await fetch(`${stack.paymentsUrl}/api/test/deliveries`).then((r) => r.json()).catch(() => null);
      throw new Error(`${error.message}\nsessions: ${JSON.stringify(rows)}\nwebhook deliveries: ${JSON.stringify(deliveries).slice(-3000)}`);
    });
  } finally {
    await lock.query("rollback").catch(() => {});
    lock.release();
  }
  await acting;
}

/** Polls until `check` returns a value other than undefined/false, or fails naming what it waited for. */
export async function eventually<T>(what: string, check: () => Promise<T | undefined | false>, timeoutMs = 30_000, everyMs = 250): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let last: unknown;
  while (Date.now() < deadline) {
    try {
      const value = await check();
      if (value !== undefined && value !== false) return value;
    } catch (error) {
      last = error;
    }
    await new Promise((r) => setTimeout(r, everyMs));
  }
  throw new Error(`timed out after ${timeoutMs / 1000} s waiting for ${what}${last ? ` (last error: ${String(last)})` : ""}`);
}
