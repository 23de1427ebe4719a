import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { LogList } from "@/components/bench/log-list";
import { StartLogForm } from "@/components/bench/start-log-form";
import { MainsCaution } from "@/components/caution";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { kitChoicesFor, listLogs } from "@/db/queries/bench";
import { checkAccess } from "@/lib/auth/guard";
import { createLogAction } from "../actions";

export const metadata: Metadata = { title: "My bench" };
export const dynamic = "force-dynamic";

export default async function BenchPage() {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/bench" />;
  const [logs, kits] = await Promise.all([listLogs(access.user.id), kitChoicesFor(access.user.id)]);

  return (
    <div className="space-y-8">
      <PageHeader
        title="My bench"
        lede="Your bring-up logs: every reading against the expected range, stage by stage, from the control supply to rated load."
      />
      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <section aria-labelledby="logs-heading" className="space-y-4">
          <h2 id="logs-heading" className="text-xl font-semibold">
            Bring-up logs
          </h2>
          {logs.length === 0 ? (
            <EmptyState title="No logs yet">
              Start one beside this list: from a kit&apos;s checkpoints, or for a build of your own. Logs are private until you share them.
            </EmptyState>
          ) : (
            <LogList logs={logs} />
          )}
        </section>
        <div className="space-y-6">
          <Panel title="Start a log">
            <StartLogForm bought={kits.bought} catalog={kits.catalog} action={createLogAction} />
          </Panel>
          <MainsCaution variant="short" />
        </div>
      </div>
    </div>
  );
}
