// What the app exposes, read from the files on disk the way Next's App Router reads them: a
// page.tsx is a page; a route.ts serves each HTTP method it exports; a module that starts with
// "use server" makes each exported async function a server action (a public POST endpoint).
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..", "..", "..");
const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? walk(full) : [full];
  });
}

const rel = (file: string) => path.relative(root, file).split(path.sep).join("/");

/** Source without comments, so a commented-out export is not counted. */
function code(file: string): string {
  return readFileSync(file, "utf8").replace(/\/\*[\s\S]*?\*\//g, "").replace(/(^|[^:"'`])\/\/.*$/gm, "$1");
}

/** Methods a route module exports: `export function GET`, `export const POST =`, `export const { GET, POST } =`, `export { GET } from`. */
export function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:async\s+)?function\s+([A-Z]+)\b/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s+(?:const|let|var)\s+([A-Z]+)\b/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s+(?:const|let|var)\s*\{([^}]*)\}\s*=/g)) for (const name of m[1]!.split(",")) found.add(name.split(":").pop()!.trim());
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) for (const name of m[1]!.split(",")) found.add(name.split(/\s+as\s+/).pop()!.trim());
  return [...found].filter((n) => (METHODS as readonly string[]).includes(n)).sort();
}

/** Whether a module is a "use server" module: the directive is its first statement. */
export function isServerActionModule(source: string): boolean {
  return /^\s*(["'])use server\1\s*;?/.test(source);
}

/** Exported async functions of a "use server" module (function declarations and async arrow constants). */
export function exportedActions(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+async\s+function\s+(\w+)/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s+const\s+(\w+)\s*=\s*async\b/g)) found.add(m[1]!);
  return [...found].sort();
}

/** Every page, route method and server action under app/, as access-matrix keys. */
export function appInventory(): string[] {
  const keys: string[] = [];
  for (const file of walk(path.join(root, "app"))) {
    const name = path.basename(file);
    if (/^page\.(tsx|ts|jsx|js)$/.test(name)) keys.push(`page ${rel(file)}`);
    if (!/\.(tsx|ts|jsx|js)$/.test(name)) continue;
    const source = code(file);
    if (/^route\.(ts|js)$/.test(name)) for (const method of exportedMethods(source)) keys.push(`route ${rel(file)} ${method}`);
    if (isServerActionModule(source)) for (const action of exportedActions(source)) keys.push(`action ${rel(file)} ${action}`);
  }
  return keys.sort();
}
