import { Markdown } from "@/components/markdown";
import { Alert } from "@/components/ui/alert";
import { Figure } from "@/components/ui/figure";
import { ProductStateBadge, StateBadge } from "@/components/ui/state-badge";
import { countWords, SAFETY_TOPICS, type SafetyNote, type SafetySheetCheck } from "@/lib/policy";

/** The check against the revision in force, one block per topic: its findings, then the seller's note. */
export function PolicyCheckPanel({ check, notes }: { check: SafetySheetCheck; notes: SafetyNote[] }) {
  const required = new Set(check.profile.requiredTopics);
  const topics = SAFETY_TOPICS.filter((t) => required.has(t.key) || notes.some((n) => n.topic === t.key));
  return (
    <div className="space-y-4" data-testid="policy-check">
      <p className="flex flex-wrap items-center gap-2">
        <ProductStateBadge kind="policy" state={check.status} />
        <span className="text-sm text-graphite-700">
          against policy revision <span className="font-mono">{check.revision}</span>
          {check.findings.length > 0 ? `, ${check.findings.length} ${check.findings.length === 1 ? "finding" : "findings"}` : ", nothing missing"}
        </span>
      </p>
      {check.status === "blocked" ? (
        <Alert tone="stop" title="This listing cannot be sold as declared">
          {check.findings.filter((f) => f.code === "ocv-over-limit").map((f) => f.message).join(" ")}
        </Alert>
      ) : null}
      <ol className="space-y-4">
        {topics.map((topic) => {
          const topicNotes = notes.filter((n) => n.topic === topic.key);
          const findings = check.findings.filter((f) => f.topic === topic.key);
          const text = topicNotes.map((n) => n.text).join("\n\n");
          const wait = topicNotes.find((n) => n.waitSeconds !== undefined)?.waitSeconds;
          return (
            <li key={topic.key} className="rounded border border-graphite-200 p-3" data-testid={`topic-${topic.key}`}>
              <div className="flex flex-wrap items-center gap-2">
                <h3 className="font-semibold">{topic.label}</h3>
                <StateBadge label={required.has(topic.key) ? "Required" : "Not required"} tone={required.has(topic.key) ? "active" : "neutral"} />
                {required.has(topic.key) ? (
                  findings.length === 0 ? <StateBadge label="Meets the policy" tone="clear" /> : <StateBadge label="Needs work" tone="caution" />
                ) : null}
                <span className="text-xs text-graphite-600">{countWords(text)} words</span>
                {wait !== undefined ? (
                  <span className="text-sm">
                    stated wait <Figure value={wait} unit="s" />
                  </span>
                ) : null}
              </div>
              {findings.length > 0 ? (
                <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-amber-700">
                  {findings.map((f) => (
                    <li key={f.code}>{f.message}</li>
                  ))}
                </ul>
              ) : null}
              <div className="mt-2 rounded bg-paper-sunken px-3 py-2 text-sm">
                {text.trim() ? <Markdown minHeadingLevel={4}>{text}</Markdown> : <p className="text-graphite-600">No note on this topic.</p>}
              </div>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
