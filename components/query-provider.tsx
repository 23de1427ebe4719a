"use client";

import type { ReactNode } from "react";
import { QueryClientProvider } from "@tanstack/react-query";
import { getQueryClient } from "@/lib/query-client";

/**
 * React Query for the parts that keep server state on the client: the catalog, the bring-up
 * bench, the seller's and the moderators' areas, the payment status. Given by those route groups'
 * layouts and pages rather than the root layout, so that pages without such parts (home, a
 * listing, the cart and checkout) do not load the library. Every provider shares the tab's one
 * client, so the cache outlives a navigation between areas.
 */
export function QueryProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={getQueryClient()}>{children}</QueryClientProvider>;
}
