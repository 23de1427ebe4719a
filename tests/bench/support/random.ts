// A seeded generator, so the same row index always gives the same row: 10,000 listings grown to
// 100,000 are the same 100,000 as generated in one go, and every run measures the same data.
import { seededRandom } from "../../support/captures";

/** mulberry32, the seeded generator the capture tests use too. */
export const seeded = seededRandom;

/** One generator per (stream, row): rows do not depend on how many rows came before them. */
export function rowRandom(stream: number, index: number): Rng {
  return new Rng(seeded(Math.imul(stream, 0x9e3779b1) ^ Math.imul(index + 1, 0x85ebca77)));
}

export class Rng {
  constructor(readonly next: () => number) {}
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }
  between(min: number, max: number): number {
    return min + this.next() * (max - min);
  }
  /** log-uniform: prices and inductances spread over decades, not evenly */
  logBetween(min: number, max: number): number {
    return Math.exp(this.between(Math.log(min), Math.log(max)));
  }
  pick<T>(items: readonly T[]): T {
    const item = items[Math.floor(this.next() * items.length)];
    if (item === undefined) throw new Error("pick from an empty list");
    return item;
  }
  /** weights in any unit; returns the key drawn */
  weighted<K extends string>(weights: Record<K, number>): K {
    const entries = Object.entries(weights) as [K, number][];
    const total = entries.reduce((s, [, w]) => s + w, 0);
    let r = this.next() * total;
    for (const [key, w] of entries) {
      r -= w;
      if (r < 0) return key;
    }
    return entries[entries.length - 1]![0];
  }
  chance(p: number): boolean {
    return this.next() < p;
  }
}

/** A deterministic UUID (version-4 layout) from a prefix of 8 hex digits and a row index. */
export function benchUuid(prefix: string, index: number): string {
  return `${prefix}-0000-4000-8000-${index.toString(16).padStart(12, "0")}`;
}
