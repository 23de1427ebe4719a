// Percentiles by the nearest-rank method (the smallest sample with at least p % of samples at or
// below it), the same for the app's and the bare query's samples so their ratio is like for like.

export type LatencySummary = { samples: number; p50: number; p95: number; p99: number; mean: number; max: number };

export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[Math.min(sorted.length, rank) - 1] ?? Number.NaN;
}

export function summarise(latenciesMs: readonly number[]): LatencySummary {
  const sorted = [...latenciesMs].sort((a, b) => a - b);
  const sum = sorted.reduce((s, v) => s + v, 0);
  return {
    samples: sorted.length,
    p50: round(percentile(sorted, 50)),
    p95: round(percentile(sorted, 95)),
    p99: round(percentile(sorted, 99)),
    mean: round(sorted.length ? sum / sorted.length : Number.NaN),
    max: round(sorted[sorted.length - 1] ?? Number.NaN),
  };
}

export function round(value: number, digits = 2): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

export function ratio(a: number, b: number): number {
  return round(a / b, 2);
}
