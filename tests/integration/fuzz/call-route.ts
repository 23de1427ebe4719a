// Calls a route handler the way Next.js does — the module's exported method with a Request and a
// `{ params }` promise — and checks what a refusal must look like: a 4xx status, a JSON body with
// an error code and a message a person can read, and field errors on a 422.
import fc from "fast-check";
import { expect } from "vitest";
import type { Method } from "./targets";

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

const modules = new Map<string, Record<string, unknown>>();

export async function routeHandler(file: string, method: Method): Promise<Handler> {
  let mod = modules.get(file);
  if (!mod) {
    mod = (await import(`../../../app/api/${file}`)) as Record<string, unknown>;
    modules.set(file, mod);
  }
  const handler = mod[method];
  if (typeof handler !== "function") throw new Error(`app/api/${file} exports no ${method}`);
  return handler as Handler;
}

/** The URL path of a route file with its parameters filled in (encoded as a browser would). */
export function routePath(file: string, params: Record<string, string>): string {
  const path = file
    .replace(/\/?route\.ts$/, "")
    .split("/")
    .map((segment) => {
      const name = /^\[(.+)\]$/.exec(segment)?.[1];
      return name ? encodeURIComponent(params[name] ?? "") : segment;
    })
    .join("/");
  return `/api/${path}`;
}

export async function callRoute(
  file: string,
  method: Method,
  { params = {}, body, query }: { params?: Record<string, string>; body?: string; query?: [string, string][] },
): Promise<Response> {
  const handler = await routeHandler(file, method);
  const url = new URL(`http://localhost:3000${routePath(file, params)}`);
  for (const [key, value] of query ?? []) url.searchParams.append(key, value);
  const request = new Request(url, {
    method,
    headers: body === undefined ? {} : { "content-type": "application/json" },
    body,
  });
  return handler(request, { params: Promise.resolve(params) });
}

export type Refusal = { status: number; error: string; message: string; fieldErrors?: Record<string, string[]> };

/** A clear refusal: 4xx, JSON with `error` and `message`, and on 422 at least one field error. */
export async function expectRefusal(response: Response, context: string): Promise<Refusal> {
  const text = await response.text();
  const where = `${context} → ${response.status} ${text.slice(0, 300)}`;
  expect(response.status, where).toBeGreaterThanOrEqual(400);
  expect(response.status, where).toBeLessThan(500);
  expect(response.headers.get("content-type") ?? "", where).toMatch(/application\/json/);
  const body = JSON.parse(text) as Refusal;
  expect(typeof body.error === "string" && body.error.length > 0, where).toBe(true);
  expect(typeof body.message === "string" && body.message.trim().length > 3, where).toBe(true);
  if (response.status === 422) {
    expect(body.fieldErrors, where).toBeTypeOf("object");
    const entries = Object.entries(body.fieldErrors ?? {});
    expect(entries.length, where).toBeGreaterThan(0);
    for (const [, messages] of entries) {
      expect(Array.isArray(messages) && messages.length > 0 && messages.every((m) => typeof m === "string" && m.length > 0), where).toBe(true);
    }
  }
  return { ...body, status: response.status };
}

/** Field error keys are paths ("reasons.0.text"); a field is named when a key is it or lies under it. */
export function namesField(fieldErrors: Record<string, string[]> | undefined, field: string): boolean {
  return Object.keys(fieldErrors ?? {}).some((key) => key === field || key.startsWith(`${field}.`));
}

/**
 * fc.assert, but reporting the first failure as it happened. A request that wrote to the database
 * leaves the digest changed, so every shrunk replay fails too and fast-check's "smallest"
 * counterexample would name an innocent input.
 */
export async function fuzz<T>(arbitrary: fc.Arbitrary<T>, check: (value: T) => Promise<void>, numRuns: number): Promise<void> {
  let first: unknown;
  try {
    await fc.assert(
      fc.asyncProperty(arbitrary, async (value) => {
        try {
          await check(value);
        } catch (error) {
          first ??= error;
          throw error;
        }
      }),
      // FUZZ_SCALE=20 runs twenty times as many cases, for a deeper search now and then.
      { numRuns: Math.round(numRuns * Number(process.env.FUZZ_SCALE ?? 1)), endOnFailure: true },
    );
  } catch (error) {
    throw first ?? error;
  }
}
