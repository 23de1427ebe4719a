import type { ReactNode } from "react";
import { QueryProvider } from "@/components/query-provider";

// This area's interactive parts keep server state with React Query (components/query-provider.tsx).
export default function AreaLayout({ children }: { children: ReactNode }) {
  return <QueryProvider>{children}</QueryProvider>;
}
