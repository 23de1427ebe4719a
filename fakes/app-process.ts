// Builds the Next.js app when its sources changed and runs `next start` as a child process.
import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import { createWriteStream, existsSync, openSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..");
const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
const SOURCES = ["app", "components", "lib", "db", "emails", "public", "package-lock.json", "next.config.mjs", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json"];
const distDir = () => process.env.FLUXYARD_DIST_DIR || ".next";
const stampFile = () => path.join(root, distDir(), "fluxyard-sources");

function sourcesFingerprint(): string {
  const hash = createHash("sha256");
  const walk = (p: string) => {
    if (!existsSync(p)) return;
    const stat = statSync(p);
    if (stat.isDirectory()) {
      for (const name of readdirSync(p).sort()) if (name !== "node_modules") walk(path.join(p, name));
    } else {
      hash.update(`${path.relative(root, p)}:${stat.size}:${stat.mtimeMs}\n`);
    }
  };
  for (const s of SOURCES) walk(path.join(root, s));
  return hash.digest("hex");
}

export function buildIsCurrent(): boolean {
  const stamp = stampFile();
  return existsSync(path.join(root, distDir(), "BUILD_ID")) && existsSync(stamp) && readFileSync(stamp, "utf8") === sourcesFingerprint();
}

/** `next build` unless the last build is of the same sources. The build needs no database or secrets. */
export async function buildApp(
  log: (line: string) => void,
  { force = false, logFile }: { force?: boolean; logFile?: string } = {},
): Promise<void> {
  if (!force && buildIsCurrent()) {
    log("the production build is up to date");
    return;
  }
  log(`building the app for production (next build, about a minute)${logFile ? `, output in ${logFile}` : ""} …`);
  const fingerprint = sourcesFingerprint();
  const out = logFile ? openSync(logFile, "w") : "inherit";
  const child = spawn(process.execPath, [nextBin, "build"], {
    cwd: root,
    stdio: ["ignore", out, out],
    env: { ...process.env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  const code = await new Promise<number>((resolve) => child.on("exit", (c) => resolve(c ?? 1)));
  if (code !== 0) {
    const detail = logFile ? `\n${readFileSync(logFile, "utf8").split("\n").slice(-40).join("\n")}` : "";
    throw new Error(`next build failed${detail}`);
  }
  writeFileSync(stampFile(), fingerprint);
}

export type AppProcess = { child: ChildProcess; url: string; stop(): Promise<void> };

export async function startApp({
  port,
  env,
  log,
  logFile,
}: {
  port: number;
  env: Record<string, string>;
  log: (line: string) => void;
  /** where the app's output goes; the terminal when not given */
  logFile?: string;
}): Promise<AppProcess> {
  const child = spawn(process.execPath, [nextBin, "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env: { ...process.env, ...env, NEXT_TELEMETRY_DISABLED: "1" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const output: string[] = [];
  const sink = logFile ? createWriteStream(logFile) : null;
  for (const stream of [child.stdout, child.stderr]) {
    stream?.on("data", (d: Buffer) => {
      if (output.length < 2000) output.push(d.toString());
      if (sink) sink.write(d);
      else process.stdout.write(d);
    });
  }
  const url = `http://127.0.0.1:${port}`;
  const exited = new Promise<number>((resolve) => child.once("exit", (code) => resolve(code ?? 1)));
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    const early = await Promise.race([exited, new Promise<null>((r) => setTimeout(() => r(null), 300))]);
    if (early !== null) throw new Error(`the app exited during start (code ${early}):\n${output.join("")}`);
    try {
      const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(5_000) });
      if (res.ok) break;
    } catch {
      // not listening yet
    }
  }
  if (Date.now() >= deadline) throw new Error(`the app did not answer ${url}/api/health within 60 s:\n${output.join("")}`);
  log(`app answering at ${url}`);
  return {
    child,
    url,
    stop: async () => {
      if (child.exitCode !== null) return;
      child.kill("SIGTERM");
      const timer = setTimeout(() => child.kill("SIGKILL"), 5_000);
      await exited;
      clearTimeout(timer);
    },
  };
}
