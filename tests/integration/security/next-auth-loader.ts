// next-auth's ESM files import "next/server" without an extension, which Node's own ESM resolver
// refuses (the next package has no "exports" map), and vitest hands packages in node_modules to
// Node unchanged. Inside Next's bundler it resolves; here a resolve hook (node:module register,
// Node ≥ 20.6) adds the ".js" Next ships, for imports of next's entry points only.
import { register } from "node:module";

const hook = `
export async function resolve(specifier, context, next) {
  if (/^next\\/(server|headers|navigation|cache)$/.test(specifier)) return next(specifier + ".js", context);
  return next(specifier, context);
}`;

register(`data:text/javascript,${encodeURIComponent(hook)}`);
