// HTTP load through autocannon: every response time is recorded, so p95 comes out by the same
// nearest-rank method as the bare-query samples (autocannon's own table stops at p97.5).
import autocannon from "autocannon";
import { LOAD } from "./config";
import { round, summarise, type LatencySummary } from "./stats";

export type LoadResult = {
  paths: number;
  connections: number;
  durationS: number;
  requests: number;
  requestsPerSecond: number;
  latencyMs: LatencySummary;
  /** the 2xx answers alone: an overloaded app that answers 500 quickly would otherwise look fast */
  latencyOkMs: LatencySummary;
  non2xx: number;
  errors: number;
  timeouts: number;
  statusCodes: Record<string, number>;
};

function fire(url: string, paths: readonly string[], connections: number, durationS: number, headers: Record<string, string>, onResponse?: (ms: number, status: number) => void) {
  const instance = autocannon({ url, connections, duration: durationS, timeout: 30, headers, requests: paths.map((path) => ({ method: "GET", path })) });
  if (onResponse) instance.on("response", (_client: unknown, status: number, _bytes: number, ms: number) => onResponse(ms, status));
  return instance;
}

/**
 * Waits until the app answers /api/health quickly again: after a heavy run it is still working
 * through requests the load generator has given up on, and the next measurement must not pay for them.
 */
export async function settle(baseUrl: string, { quickMs = 250, timeoutS = 120 } = {}): Promise<boolean> {
  const deadline = Date.now() + timeoutS * 1000;
  let quick = 0;
  while (Date.now() < deadline) {
    const started = performance.now();
    try {
      const res = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(10_000) });
      await res.text();
      quick = res.ok && performance.now() - started < quickMs ? quick + 1 : 0;
      if (quick >= 3) return true;
    } catch {
      quick = 0;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  console.warn(`[bench] warning: the app was still slow to answer /api/health after ${timeoutS} s`);
  return false;
}

/** Settles the app, warms up for LOAD.warmupS, then measures for durationS with the same mix of paths. */
export async function loadTest({
  baseUrl,
  paths,
  connections = LOAD.connections,
  durationS = LOAD.durationS,
  warmupS = LOAD.warmupS,
  headers = {},
}: {
  baseUrl: string;
  paths: readonly string[];
  connections?: number;
  durationS?: number;
  warmupS?: number;
  headers?: Record<string, string>;
}): Promise<LoadResult> {
  await settle(baseUrl);
  if (warmupS > 0) await fire(baseUrl, paths, connections, warmupS, headers);
  const latencies: number[] = [];
  const okLatencies: number[] = [];
  const result = await fire(baseUrl, paths, connections, durationS, headers, (ms, status) => {
    latencies.push(ms);
    if (status >= 200 && status < 300) okLatencies.push(ms);
  });
  const statusCodes = Object.fromEntries(Object.entries(result.statusCodeStats ?? {}).map(([code, s]) => [code, Number(s.count)]));
  return {
    paths: paths.length,
    connections,
    durationS: result.duration,
    requests: latencies.length,
    requestsPerSecond: round(latencies.length / result.duration, 1),
    latencyMs: summarise(latencies),
    latencyOkMs: summarise(okLatencies),
    non2xx: result.non2xx,
    errors: result.errors,
    timeouts: result.timeouts,
    statusCodes,
  };
}

/** Share of answers that were 2xx; below 1 the latency figures include failures (the app answering 500 fast or slow). */
export function okShare(result: LoadResult): number {
  const total = result.requests + result.errors + result.timeouts;
  return total === 0 ? 0 : round((result.requests - result.non2xx) / total, 3);
}

/** A load run where some answers failed still has figures, but they need saying so. */
export function warnIfFailed(label: string, result: LoadResult): string | null {
  if (result.requests === 0) {
    const note = `${label}: no answer at all within the run`;
    console.warn(`[bench] warning: ${note}`);
    return note;
  }
  if (result.non2xx === 0 && result.errors === 0 && result.timeouts === 0) return null;
  const note = `${label}: ${result.non2xx} non-2xx answers, ${result.errors} connection errors, ${result.timeouts} timeouts of ${result.requests + result.errors + result.timeouts} (${JSON.stringify(result.statusCodes)})`;
  console.warn(`[bench] warning: ${note}`);
  return note;
}
