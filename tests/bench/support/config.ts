// Where the benchmarks run: their own cluster, database, build folder and ports, clear of
// `npm start` (3000/4010–4030/54329) and every test slot (fakes/local-config.ts testPorts: app
// 3100+10N, fakes 4110+100N…, PostgreSQL 54339+2N — always odd, so an even port never meets one).
import path from "node:path";
import type { LocalPorts } from "../../../fakes/local-config";

export const ROOT = path.resolve(import.meta.dirname, "..", "..", "..");

export const BENCH_PORTS: LocalPorts = { app: 3990, mail: 4990, payments: 4991, uploads: 4992, db: 54398 };

export const BENCH_DATA_DIR = path.join(ROOT, ".data", "pg-bench");
export const BENCH_DATABASE = "fluxyard_bench";
export const BENCH_DIST_DIR = ".next-bench";
export const ARTIFACTS_DIR = path.join(ROOT, "tests", ".artifacts", "bench");

/** The catalog is measured at both sizes; everything else on the larger one. */
export const SMALL_LISTINGS = 10_000;
export const FULL_LISTINGS = 100_000;

/** Load generator settings shared by every HTTP benchmark, so their figures compare. */
export const LOAD = { connections: 10, durationS: 15, warmupS: 3 };

export const AUTH_SECRET = "bench-secret-for-the-benchmark-app-only-0123456789";

export const CHROMIUM_PATH = "/usr/bin/chromium";
export const CHROMIUM_FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];
