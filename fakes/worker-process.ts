// Runs the background worker (lib/jobs/worker.ts) as a child process beside the app.
import { spawn } from "node:child_process";
import { createWriteStream } from "node:fs";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..");

export async function startWorker({ env, log, logFile }: { env: Record<string, string>; log: (line: string) => void; logFile?: string }) {
  const child = spawn(process.execPath, ["--import", "./lib/jobs/register-hooks.mjs", "lib/jobs/worker.ts"], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const sink = logFile ? createWriteStream(logFile) : null;
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("the background worker did not start within 30 s")), 30_000);
    child.once("exit", (code) => reject(new Error(`the background worker exited during start (code ${code})`)));
    for (const stream of [child.stdout, child.stderr]) {
      stream.on("data", (d: Buffer) => {
        if (sink) sink.write(d);
        else process.stdout.write(d);
        if (d.toString().includes("[worker] ready")) {
          clearTimeout(timer);
          resolve();
        }
      });
    }
  });
  await ready;
  log("background worker running");
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  return {
    child,
    stop: async () => {
      if (child.exitCode !== null) return;
      child.kill("SIGTERM");
      const timer = setTimeout(() => child.kill("SIGKILL"), 8_000);
      await exited;
      clearTimeout(timer);
    },
  };
}
