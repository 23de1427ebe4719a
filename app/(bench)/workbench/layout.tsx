import type { ReactNode } from "react";
import { WorkbenchNav } from "@/components/workbench/workbench-nav";

export default function WorkbenchLayout({ children }: { children: ReactNode }) {
  return (
    <div className="space-y-6">
      <WorkbenchNav />
      {children}
    </div>
  );
}
