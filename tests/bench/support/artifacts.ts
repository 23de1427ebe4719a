// Every benchmark leaves its figures as JSON beside the console output, for the README and for
// comparing one run with the next.
import { mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { ARTIFACTS_DIR } from "./config";

export function machine() {
  const cpus = os.cpus();
  return {
    cpu: cpus[0]?.model ?? "unknown",
    cores: cpus.length,
    memoryGiB: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    platform: `${os.type()} ${os.release()}`,
    loadAverage: os.loadavg().map((l) => Math.round(l * 100) / 100),
  };
}

/** `loadBefore`: the machine's load average when the benchmark started (others' work on a shared machine shows here). */
export function writeFigures(name: string, figures: unknown, { startedAt, loadBefore }: { startedAt: Date; loadBefore: number[] }): string {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const file = path.join(ARTIFACTS_DIR, `${name}.json`);
  const run = { startedAt: startedAt.toISOString(), seconds: Math.round((Date.now() - startedAt.getTime()) / 1000), loadAverageBefore: loadBefore.map((l) => Math.round(l * 100) / 100) };
  writeFileSync(file, `${JSON.stringify({ name, at: new Date().toISOString(), machine: machine(), run, figures }, null, 2)}\n`);
  return file;
}
