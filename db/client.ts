import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema>;
/** A transaction handle; multi-row writes pass it down so they commit together. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type Executor = Db | Tx;

type Cache = { pool?: pg.Pool; db?: Db };
// One client per process; in development it survives hot reloads on globalThis.
const cache: Cache =
  process.env.NODE_ENV === "development"
    ? (((globalThis as { __fluxyardDb?: Cache }).__fluxyardDb ??= {}) as Cache)
    : {};

export function createPool(connectionString: string): pg.Pool {
  const pool = new pg.Pool({
    connectionString,
    max: 10,
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 30_000,
    // A query that hangs must not hold a request forever.
    statement_timeout: 15_000,
  });
  // A client that loses its server (a database restart) must not crash the process, whether idle or
  // checked out for a transaction: the pool listens on idle clients only, and an "error" event nobody
  // hears throws. The query in flight fails on its own, and the pool drops the broken client.
  pool.on("connect", (client) => {
    client.on("error", (error) => console.error("[db] connection lost:", error.message));
  });
  // The pool re-emits an idle client's error, which the listener above has already logged.
  pool.on("error", () => {});
  return pool;
}

export function getPool(): pg.Pool {
  cache.pool ??= createPool(env().DATABASE_URL);
  return cache.pool;
}

export function getDb(): Db {
  cache.db ??= drizzle(getPool(), { schema });
  return cache.db;
}

/** The database, created on first use so that building the app never needs one. */
export const db: Db = new Proxy({} as Db, {
  get(_target, property) {
    const real = getDb() as unknown as Record<PropertyKey, unknown>;
    const value = real[property];
    return typeof value === "function" ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
});

export async function closeDb(): Promise<void> {
  const pool = cache.pool;
  cache.pool = undefined;
  cache.db = undefined;
  await pool?.end();
}
