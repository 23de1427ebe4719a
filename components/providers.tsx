"use client";

// First, before any schema is built in the browser: no `new Function` probe under the CSP.
import "@/lib/http/zod-without-eval";
import type { ReactNode } from "react";

/**
 * What every page needs on the client before anything else. React Query is not here: the areas
 * that use it wrap themselves in `QueryProvider` (components/query-provider.tsx).
 */
export function Providers({ children }: { children: ReactNode }) {
  return children;
}
