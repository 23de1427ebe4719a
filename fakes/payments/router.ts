import type { FakeContext, Origin } from "./context";
import type { FormObject } from "./form-body";

export interface ApiCall {
  ctx: FakeContext;
  params: Record<string, string>;
  /** The body of a POST, or the query string of a GET or DELETE. */
  input: FormObject;
  origin: Origin;
}

export type ApiHandler = (call: ApiCall) => unknown;

export interface Route {
  method: "GET" | "POST" | "DELETE";
  pattern: string;
  handler: ApiHandler;
}

export function matchRoute(routes: readonly Route[], method: string, path: string): { route: Route; params: Record<string, string> } | undefined {
  const parts = path.split("/").filter(Boolean);
  for (const route of routes) {
    if (route.method !== method) continue;
    const wanted = route.pattern.split("/").filter(Boolean);
    if (wanted.length !== parts.length) continue;
    const params: Record<string, string> = {};
    let ok = true;
    for (let i = 0; i < wanted.length && ok; i += 1) {
      const want = wanted[i] ?? "";
      const got = parts[i] ?? "";
      if (want.startsWith(":")) {
        try {
          params[want.slice(1)] = decodeURIComponent(got);
        } catch {
          ok = false;
        }
      } else if (want !== got) ok = false;
    }
    if (ok) return { route, params };
  }
  return undefined;
}

/** True when some route has this path under another method, for a 405-style answer. */
export function pathKnown(routes: readonly Route[], path: string): boolean {
  return ["GET", "POST", "DELETE"].some((method) => matchRoute(routes, method, path) !== undefined);
}
