import type { PublishedRevisionRow } from "@/db/queries/moderation";
import { Figure } from "@/components/ui/figure";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { POLICY_REVISIONS, SAFETY_TOPICS, type PolicyRevision, type TopicCondition } from "@/lib/policy";

const WHEN: Record<TopicCondition, string> = {
  always: "every listing",
  "mains-connected": "mains-connected",
  "stored-charge": "bus above the safe voltage and charge above the threshold",
  "live-heatsinks": "heatsinks at bus potential",
  "welding-source": "welding power source",
};

export function PolicyFigures({ rules }: { rules: PolicyRevision }) {
  return (
    <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1" data-testid="policy-figures">
      <dt className="text-sm text-graphite-600">Minimum words per note</dt>
      <dd className="figure font-mono">{rules.minWords}</dd>
      <dt className="text-sm text-graphite-600">Safe voltage</dt>
      <dd>
        <Figure value={rules.safeVoltageV} unit="V" />
      </dd>
      <dt className="text-sm text-graphite-600">Stored-charge threshold</dt>
      <dd>
        <Figure value={rules.storedChargeThresholdC} unit="C" />
      </dd>
      <dt className="text-sm text-graphite-600">Wait margin</dt>
      <dd className="figure font-mono">× {rules.waitMarginFactor} the computed discharge time</dd>
    </dl>
  );
}

/** The revision's topics: when each is required and how many words its note needs. */
export function PolicyTopicsTable({ rules }: { rules: PolicyRevision }) {
  return (
    <Table caption={`Topics in revision ${rules.revision}`}>
      <THead>
        <TRow>
          <TH>Topic</TH>
          <TH>Required for</TH>
          <TH numeric>Minimum words</TH>
        </TRow>
      </THead>
      <TBody>
        {SAFETY_TOPICS.map((topic) => {
          const topicRules = rules.topicRules.filter((r) => r.topic === topic.key);
          const override = topicRules.map((r) => r.minWords).filter((v): v is number => v !== undefined);
          return (
            <TRow key={topic.key}>
              <TD>{topic.label}</TD>
              <TD>{topic.key === "codes-and-competence" ? "every listing" : topicRules.map((r) => WHEN[r.when]).join("; ") || "—"}</TD>
              <TD numeric>
                {override.length ? Math.max(...override) : rules.minWords}
                {override.length ? <StateBadge className="ml-2" label="own minimum" tone="active" /> : null}
              </TD>
            </TRow>
          );
        })}
      </TBody>
    </Table>
  );
}

/** Every revision, the newest first; revision 1 is built into the platform. */
export function PolicyHistoryTable({ published }: { published: PublishedRevisionRow[] }) {
  const builtIn = POLICY_REVISIONS.filter((r) => !published.some((p) => p.revision === r.revision)).map((r) => ({
    revision: r.revision,
    summary: r.summary,
    graceDays: null as number | null,
    publishedAt: new Date(r.publishedAt),
    publishedBy: "built in",
    rules: r,
  }));
  const rows = [...published, ...builtIn].sort((a, b) => b.revision - a.revision);
  return (
    <Table caption="Published revisions, the newest first" captionHidden data-testid="policy-history">
      <THead>
        <TRow>
          <TH numeric>Revision</TH>
          <TH>Published</TH>
          <TH>Summary</TH>
          <TH numeric>Min. words</TH>
          <TH numeric>Wait margin</TH>
          <TH numeric>Grace</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((r) => (
          <TRow key={r.revision}>
            <TD numeric>{r.revision}</TD>
            <TD className="whitespace-nowrap">
              <span className="font-mono text-xs">{r.publishedAt.toISOString().slice(0, 10)}</span>
              <div className="text-xs text-graphite-600">{r.publishedBy ?? "—"}</div>
            </TD>
            <TD className="max-w-md text-sm">{r.summary}</TD>
            <TD numeric>{r.rules.minWords}</TD>
            <TD numeric>× {r.rules.waitMarginFactor}</TD>
            <TD numeric>{r.graceDays === null ? "—" : `${r.graceDays} d`}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
