// The part of autocannon 8's API the benchmarks use (the package ships no types).
declare module "autocannon" {
  import type { EventEmitter } from "node:events";

  export type Request = { method?: string; path: string; headers?: Record<string, string> };
  export type Options = {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    timeout?: number;
    headers?: Record<string, string>;
    requests?: Request[];
  };
  export type Histogram = { average: number; mean: number; stddev: number; min: number; max: number; total: number; p50: number; p90: number; p97_5: number; p99: number };
  export type Result = {
    duration: number;
    requests: Histogram & { sent: number };
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
  };
  export type Instance = EventEmitter & Promise<Result> & { stop(): void };

  export default function autocannon(options: Options): Instance;
}
