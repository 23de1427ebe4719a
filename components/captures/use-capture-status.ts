"use client";

import { useQuery } from "@tanstack/react-query";
import type { CaptureStatusView } from "@/lib/captures/types";

export const captureStatusKey = (id: string) => ["capture-status", id] as const;

const POLL_MS = 1000;

async function fetchStatus(id: string): Promise<CaptureStatusView> {
  const response = await fetch(`/api/captures/${encodeURIComponent(id)}`, { headers: { accept: "application/json" }, cache: "no-store" });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as { message?: string } | null;
    throw new Error(body?.message ?? `The capture's state could not be read (${response.status}).`);
  }
  return (await response.json()) as CaptureStatusView;
}

/**
 * The capture's state, starting from what the page rendered and polled every second while it is
 * waiting or being measured; polling stops once it is measured or has failed.
 */
export function useCaptureStatus(initial: CaptureStatusView) {
  return useQuery({
    queryKey: captureStatusKey(initial.id),
    queryFn: () => fetchStatus(initial.id),
    initialData: initial,
    // The page's render is the truth at load; poll from there rather than refetching at once (a
    // staleTime of 0 made every card and proposal of a measured capture ask again while the page loaded).
    initialDataUpdatedAt: Date.now(),
    staleTime: POLL_MS,
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === "queued" || state === "measuring" ? POLL_MS : false;
    },
    refetchIntervalInBackground: false,
    retry: 3,
  });
}
