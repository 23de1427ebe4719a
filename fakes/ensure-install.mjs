// Plain Node (no dependencies): makes sure node_modules matches package-lock.json before anything else runs.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export function ensureInstalled() {
  const lock = path.join(projectRoot, "package-lock.json");
  const installed = path.join(projectRoot, "node_modules", ".package-lock.json");
  const fresh = !existsSync(installed);
  const stale = !fresh && existsSync(lock) && statSync(lock).mtimeMs > statSync(installed).mtimeMs + 1000;
  if (!fresh && !stale) return;
  const args = fresh && existsSync(lock) ? ["ci"] : ["install"];
  console.log(`[fluxyard] installing dependencies (npm ${args[0]}) …`);
  const result = spawnSync("npm", [...args, "--no-audit", "--no-fund"], { cwd: projectRoot, stdio: "inherit" });
  if (result.status !== 0) {
    console.error("[fluxyard] npm could not install the dependencies; see the output above.");
    process.exit(result.status ?? 1);
  }
}

/** Runs a TypeScript entry point with the project's tsx, forwarding signals; resolves to the exit code. */
export function runTypeScript(entry, args = []) {
  const tsx = path.join(projectRoot, "node_modules", "tsx", "dist", "cli.mjs");
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [tsx, path.join(projectRoot, entry), ...args], { cwd: projectRoot, stdio: "inherit" });
    // The child handles Ctrl-C itself (it shares the terminal); a SIGTERM sent to us alone is passed on.
    process.on("SIGINT", () => {});
    process.on("SIGTERM", () => child.kill("SIGTERM"));
    child.on("exit", (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}
