"use client";

// First, before any schema is built in the browser: no `new Function` probe under the CSP.
import "@/lib/http/zod-without-eval";
import type { ReactNode } from "react";
import { QueryClientProvider } from "@tanstack/react-query";
import { getQueryClient } from "@/lib/query-client";

export function Providers({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={getQueryClient()}>{children}</QueryClientProvider>;
}
