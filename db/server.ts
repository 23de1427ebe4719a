// Lifecycle of the embedded PostgreSQL server used by `npm start` and `npm test`.
// With DATABASE_URL set, nothing is started and that server is used as it is.
import { execFileSync, spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, rmSync, statSync, writeFileSync, chownSync } from "node:fs";
import { createHash } from "node:crypto";
import path from "node:path";
import os from "node:os";
import pg from "pg";

export type DatabaseServer = {
  url: string;
  /** true when DATABASE_URL pointed at a server we did not start */
  external: boolean;
  stop(): Promise<void>;
  /**
   * Stops the embedded server and starts it again on the same folder, port and settings, for fault
   * tests. `immediate` is what a crash looks like to clients (no checkpoint; the server replays its
   * write-ahead log at start); `fast` is an orderly restart. Refused for a server we did not start.
   */
  restart(options?: RestartOptions): Promise<void>;
};

export type RestartOptions = {
  mode?: "fast" | "immediate";
  /** how long the server stays down between the stop and the start */
  downMs?: number;
};

export type EmbeddedOptions = {
  /** project-relative or absolute folder for the cluster */
  dataDir: string;
  port: number;
  database: string;
  /** wipe the cluster before starting (tests) */
  fresh?: boolean;
  log?: (line: string) => void;
};

const SUPERUSER = "fluxyard";
const OS_USER_FALLBACK = "fluxyard-pg";

export async function startDatabase(options: EmbeddedOptions, env: NodeJS.ProcessEnv = process.env): Promise<DatabaseServer> {
  const log = options.log ?? (() => {});
  if (env.DATABASE_URL) {
    log(`using the PostgreSQL server at DATABASE_URL`);
    await waitForConnection(env.DATABASE_URL, 15_000);
    return {
      url: env.DATABASE_URL,
      external: true,
      stop: async () => {},
      restart: async () => {
        throw new Error("cannot restart the PostgreSQL server at DATABASE_URL: it was not started here");
      },
    };
  }

  const bin = findPostgresBin() ?? installPostgres(log);
  const runAs = pickOsUser();
  const dataDir = resolveDataDir(options.dataDir, runAs);
  const logFile = path.join(path.dirname(dataDir), `${path.basename(dataDir)}.log`);

  if (options.fresh && existsSync(dataDir)) {
    stopCluster(bin, dataDir, runAs);
    rmSync(dataDir, { recursive: true, force: true });
  }

  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    own(dataDir, runAs);
    log(`initialising a PostgreSQL cluster in ${dataDir}`);
    run(runAs, path.join(bin, "initdb"), ["-D", dataDir, "-U", SUPERUSER, "--auth=trust", "-E", "UTF8", "--locale=C.UTF-8"]);
  }
  writeFileSync(logFile, "", { flag: "a" });
  own(logFile, runAs);

  // TCP on loopback only; no Unix socket, so the project path length never matters.
  const serverOptions = `-c listen_addresses=127.0.0.1 -p ${options.port} -c unix_socket_directories= -c fsync=${options.fresh ? "off" : "on"}`;
  const start = () => {
    const result = run(runAs, path.join(bin, "pg_ctl"), ["-D", dataDir, "-l", logFile, "-w", "-t", "60", "-o", serverOptions, "start"], false);
    if (result.status !== 0) {
      throw new Error(`PostgreSQL did not start (see ${logFile}):\n${result.stderr}${result.stdout}\n${tail(logFile)}`);
    }
  };
  if (!clusterRunning(bin, dataDir, runAs)) {
    log(`starting PostgreSQL on 127.0.0.1:${options.port}`);
    start();
  } else {
    log(`PostgreSQL is already running for ${dataDir}`);
  }

  const adminUrl = `postgres://${SUPERUSER}@127.0.0.1:${options.port}/postgres`;
  await waitForConnection(adminUrl, 30_000);
  await createDatabaseIfMissing(adminUrl, options.database);

  return {
    url: `postgres://${SUPERUSER}@127.0.0.1:${options.port}/${options.database}`,
    external: false,
    stop: async () => {
      stopCluster(bin, dataDir, runAs);
    },
    restart: async ({ mode = "fast", downMs = 0 } = {}) => {
      log(`restarting PostgreSQL on 127.0.0.1:${options.port} (${mode} stop, down for ${downMs} ms)`);
      // Without blocking the event loop, so a test can keep sending requests meanwhile.
      const pgCtl = path.join(bin, "pg_ctl");
      const stopped = await runAsync(runAs, pgCtl, ["-D", dataDir, "-m", mode, "-w", "stop"]);
      if (stopped.status !== 0) throw new Error(`pg_ctl stop failed:\n${stopped.output}`);
      await new Promise((resolve) => setTimeout(resolve, downMs));
      const started = await runAsync(runAs, pgCtl, ["-D", dataDir, "-l", logFile, "-w", "-t", "60", "-o", serverOptions, "start"]);
      if (started.status !== 0) throw new Error(`PostgreSQL did not start again (see ${logFile}):\n${started.output}\n${tail(logFile)}`);
      await waitForConnection(adminUrl, 30_000);
    },
  };
}

export async function createDatabaseIfMissing(adminUrl: string, database: string, template?: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const found = await client.query("select 1 from pg_database where datname = $1", [database]);
    if (found.rowCount === 0) {
      const from = template ? ` template ${quoteIdent(template)}` : "";
      await client.query(`create database ${quoteIdent(database)}${from}`);
    }
  } finally {
    await client.end();
  }
}

export async function dropDatabase(adminUrl: string, database: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`drop database if exists ${quoteIdent(database)} with (force)`);
  } finally {
    await client.end();
  }
}

export async function waitForConnection(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 2_000 });
    try {
      await client.connect();
      await client.query("select 1");
      await client.end();
      return;
    } catch (error) {
      lastError = error;
      await client.end().catch(() => {});
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  throw new Error(`PostgreSQL at ${redact(url)} did not accept connections within ${timeoutMs / 1000} s: ${String(lastError)}`);
}

export function findPostgresBin(root = "/usr/lib/postgresql"): string | null {
  if (!existsSync(root)) return null;
  const versions = readdirSync(root)
    .filter((v) => existsSync(path.join(root, v, "bin", "initdb")) && existsSync(path.join(root, v, "bin", "pg_ctl")))
    .sort((a, b) => Number(b) - Number(a));
  const newest = versions[0];
  return newest ? path.join(root, newest, "bin") : null;
}

function installPostgres(log: (line: string) => void): string {
  if (process.getuid?.() !== 0) {
    throw new Error(
      "PostgreSQL server binaries were not found in /usr/lib/postgresql/*/bin.\n" +
        "Install Debian's PostgreSQL server package and run the command again:\n" +
        "    sudo apt-get update && sudo apt-get install -y postgresql\n" +
        "or set DATABASE_URL to a PostgreSQL server you already run.",
    );
  }
  log("PostgreSQL is not installed; installing Debian's postgresql package with apt-get (about a minute)");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "postgresql"], { stdio: "inherit", env });
  const bin = findPostgresBin();
  if (!bin) throw new Error("apt-get installed postgresql, but no initdb was found in /usr/lib/postgresql/*/bin");
  return bin;
}

type OsUser = { name: string; uid: number; gid: number } | null;

/** PostgreSQL refuses to run as root: as root, run it as Debian's postgres user (or one we create). */
function pickOsUser(): OsUser {
  if (process.getuid?.() !== 0) return null;
  for (const name of ["postgres", OS_USER_FALLBACK]) {
    const ids = lookupUser(name);
    if (ids) return { name, ...ids };
  }
  execFileSync("useradd", ["--system", "--no-create-home", "--shell", "/usr/sbin/nologin", OS_USER_FALLBACK]);
  const ids = lookupUser(OS_USER_FALLBACK);
  if (!ids) throw new Error(`could not create the OS user ${OS_USER_FALLBACK} for PostgreSQL`);
  return { name: OS_USER_FALLBACK, ...ids };
}

function lookupUser(name: string): { uid: number; gid: number } | null {
  const uid = spawnSync("id", ["-u", name], { encoding: "utf8" });
  const gid = spawnSync("id", ["-g", name], { encoding: "utf8" });
  if (uid.status !== 0 || gid.status !== 0) return null;
  return { uid: Number(uid.stdout.trim()), gid: Number(gid.stdout.trim()) };
}

/**
 * The cluster lives in the project's git-ignored .data folder. When the unprivileged user cannot reach
 * that folder (a checkout inside /root, say), it lives in /var/tmp instead, keyed by the project path.
 */
function resolveDataDir(dataDir: string, runAs: OsUser): string {
  const wanted = path.resolve(dataDir);
  mkdirSync(path.dirname(wanted), { recursive: true });
  if (!runAs) return wanted;
  const probe = spawnSync("runuser", ["-u", runAs.name, "--", "test", "-x", path.dirname(wanted)]);
  if (probe.status === 0) return wanted;
  const key = createHash("sha256").update(wanted).digest("hex").slice(0, 12);
  const fallback = path.join("/var/tmp", `fluxyard-${key}`, path.basename(wanted));
  mkdirSync(path.dirname(fallback), { recursive: true });
  own(path.dirname(fallback), runAs);
  return fallback;
}

function own(target: string, runAs: OsUser) {
  if (runAs) chownSync(target, runAs.uid, runAs.gid);
}

function run(runAs: OsUser, command: string, args: string[], check = true) {
  const [cmd, argv] = runAs ? ["runuser", ["-u", runAs.name, "--", command, ...args]] : [command, args];
  // cwd /tmp: the postgres user may not be able to enter the caller's folder.
  const result = spawnSync(cmd as string, argv as string[], { encoding: "utf8", cwd: os.tmpdir() });
  if (check && result.status !== 0) {
    throw new Error(`${path.basename(command)} failed (exit ${result.status}):\n${result.stderr}${result.stdout}`);
  }
  return result;
}

function runAsync(runAs: OsUser, command: string, args: string[]): Promise<{ status: number; output: string }> {
  const [cmd, argv] = runAs ? ["runuser", ["-u", runAs.name, "--", command, ...args]] : [command, args];
  return new Promise((resolve) => {
    const child = spawn(cmd as string, argv as string[], { cwd: os.tmpdir(), stdio: ["ignore", "pipe", "pipe"] });
    let output = "";
    child.stdout.on("data", (d: Buffer) => (output += d.toString()));
    child.stderr.on("data", (d: Buffer) => (output += d.toString()));
    child.on("error", (error) => resolve({ status: 1, output: `${output}${error.message}` }));
    child.on("close", (code) => resolve({ status: code ?? 1, output }));
  });
}

function clusterRunning(bin: string, dataDir: string, runAs: OsUser): boolean {
  return run(runAs, path.join(bin, "pg_ctl"), ["-D", dataDir, "status"], false).status === 0;
}

function stopCluster(bin: string, dataDir: string, runAs: OsUser) {
  if (!existsSync(path.join(dataDir, "PG_VERSION"))) return;
  if (!clusterRunning(bin, dataDir, runAs)) return;
  run(runAs, path.join(bin, "pg_ctl"), ["-D", dataDir, "-m", "fast", "-w", "stop"], false);
}

function tail(file: string): string {
  try {
    const text = execFileSync("tail", ["-n", "20", file], { encoding: "utf8" });
    return text;
  } catch {
    return "";
  }
}

function quoteIdent(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}

/** The same server with another database name. */
export function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

export function redact(url: string): string {
  return url.replace(/\/\/([^:@/]+):[^@/]*@/, "//$1:***@");
}

export function isDirectory(p: string): boolean {
  try {
    return statSync(p).isDirectory();
  } catch {
    return false;
  }
}
