"use client";

import { useEffect, useState } from "react";

const UNITS: [Intl.RelativeTimeFormatUnit, number][] = [
  ["day", 86_400_000],
  ["hour", 3_600_000],
  ["minute", 60_000],
];

const format = new Intl.RelativeTimeFormat("en", { numeric: "auto" });

/**
 * "3 hours ago" for a moment in the past (or "in 2 days" for one ahead), in the largest unit it
 * fills, rounded: a grace period of 14 days that started a minute ago still reads "in 14 days".
 */
export function relativeTime(iso: string, now: number): string {
  const delta = new Date(iso).getTime() - now;
  for (const [unit, ms] of UNITS) {
    if (Math.abs(delta) >= ms) return format.format(Math.round(delta / ms), unit);
  }
  return "just now";
}

/**
 * A moment as relative words with the exact ISO time beside it. The words are recomputed each
 * minute in the browser; the server's first render may be a minute off, hence the warning opt-out.
 */
export function RelativeTime({ iso, showIso = true }: { iso: string; showIso?: boolean }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 60_000);
    return () => clearInterval(timer);
  }, []);
  return (
    <span className="whitespace-nowrap">
      <time dateTime={iso} title={iso} suppressHydrationWarning>
        {relativeTime(iso, now)}
      </time>
      {showIso ? <span className="ml-2 font-mono text-xs text-graphite-600">{iso.slice(0, 16).replace("T", " ")} UTC</span> : null}
    </span>
  );
}
