// Starts tests/bench/support/app-side.ts in a child process with the app's environment and
// returns what it wrote.
import { spawn } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { ROOT } from "./config";
import type { CaptureJob, CaptureResult, CatalogBareJob, CatalogBareResult, Job, MakeScopeCaptureJob } from "./app-side";

export function runAppSide(job: CatalogBareJob, appEnv: Record<string, string>): Promise<CatalogBareResult>;
export function runAppSide(job: CaptureJob, appEnv: Record<string, string>): Promise<CaptureResult>;
export function runAppSide(job: MakeScopeCaptureJob, appEnv: Record<string, string>): Promise<{ captureId: string }>;
export async function runAppSide(job: Job, appEnv: Record<string, string>): Promise<unknown> {
  const dir = mkdtempSync(path.join(os.tmpdir(), "fluxyard-bench-"));
  const jobFile = path.join(dir, "job.json");
  const outFile = path.join(dir, "out.json");
  writeFileSync(jobFile, JSON.stringify(job));
  try {
    const child = spawn(process.execPath, ["--import", "./lib/jobs/register-hooks.mjs", "tests/bench/support/app-side.ts", jobFile, outFile], {
      cwd: ROOT,
      env: { ...process.env, ...appEnv },
      stdio: ["ignore", "inherit", "inherit"],
    });
    const code = await new Promise<number>((resolve) => child.once("exit", (c) => resolve(c ?? 1)));
    if (code !== 0) throw new Error(`the app-side ${job.kind} run failed (exit ${code})`);
    return JSON.parse(readFileSync(outFile, "utf8")) as unknown;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
