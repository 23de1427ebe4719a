import type { ReactNode } from "react";
import { cx } from "@/components/ui/cx";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import type { DiffLine, SnapshotDiff, ValueChange } from "@/lib/moderation/diff";
import { snapshotDiffIsEmpty } from "@/lib/moderation/diff";
import { topicLabel, type SafetyTopicKey } from "@/lib/policy";
import { figureLabel, figureValue } from "./listing-figures";

const MARKS: Record<DiffLine["op"], { sign: string; word: string; className: string }> = {
  same: { sign: " ", word: "unchanged", className: "text-graphite-700" },
  added: { sign: "+", word: "added", className: "bg-verdigris-50 text-verdigris-800" },
  removed: { sign: "−", word: "removed", className: "bg-signal-50 text-signal-800 line-through decoration-signal-300" },
};

/** A line diff; each changed line carries its sign and a hidden word, so it never rests on colour. */
export function LineDiffView({ lines, label }: { lines: DiffLine[]; label: string }) {
  return (
    <pre aria-label={label} className="overflow-x-auto rounded border border-graphite-200 bg-paper-raised py-1 font-mono text-xs leading-5">
      {lines.map((line, i) => {
        const mark = MARKS[line.op];
        return (
          <div key={i} className={cx("px-2 whitespace-pre-wrap", mark.className)} data-op={line.op}>
            <span aria-hidden="true" className="mr-2 select-none">
              {mark.sign}
            </span>
            {line.op !== "same" ? <span className="sr-only">{mark.word}: </span> : null}
            {line.text === "" ? "\u00a0" : line.text}
          </div>
        );
      })}
    </pre>
  );
}

function show(key: string, value: unknown): ReactNode {
  return value === undefined ? <span className="text-graphite-500">not set</span> : figureValue(key, value);
}

function ValueChanges({ changes, caption }: { changes: ValueChange[]; caption: string }) {
  return (
    <Table caption={caption}>
      <THead>
        <TRow>
          <TH>Field</TH>
          <TH>Approved</TH>
          <TH>Now</TH>
        </TRow>
      </THead>
      <TBody>
        {changes.map((c) => (
          <TRow key={c.key}>
            <TD>{figureLabel(c.key)}</TD>
            <TD>{show(c.key, c.before)}</TD>
            <TD className="font-semibold">{show(c.key, c.after)}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="space-y-2">
      <h3 className="font-semibold">{title}</h3>
      {children}
    </section>
  );
}

const CHANGE_WORDS = { added: "New note", removed: "Note removed", changed: "Note changed" } as const;

/** What changed since the version a moderator last approved, part by part. */
export function SnapshotDiffView({ diff }: { diff: SnapshotDiff }) {
  if (snapshotDiffIsEmpty(diff)) {
    return <p className="text-graphite-700">Nothing in the title, description, figures, declaration, notes, checkpoints or requirements changed since the approval.</p>;
  }
  return (
    <div className="space-y-6" data-testid="snapshot-diff">
      {diff.title ? (
        <Part title="Title">
          <LineDiffView lines={diff.title} label="Title, approved and now" />
        </Part>
      ) : null}
      {diff.kind.length > 0 ? (
        <Part title="Kind">
          <ValueChanges changes={diff.kind} caption="Kind, approved and now" />
        </Part>
      ) : null}
      {diff.description ? (
        <Part title="Description">
          <LineDiffView lines={diff.description} label="Description, approved and now" />
        </Part>
      ) : null}
      {diff.figures.length > 0 ? (
        <Part title="Figures">
          <ValueChanges changes={diff.figures} caption="Figures, approved and now" />
        </Part>
      ) : null}
      {diff.declaration.length > 0 ? (
        <Part title="Safety declaration">
          <ValueChanges changes={diff.declaration} caption="Declaration, approved and now" />
        </Part>
      ) : null}
      {diff.notes.length > 0 ? (
        <Part title="Safety notes">
          {diff.notes.map((n) => (
            <div key={n.topic} className="space-y-1">
              <p className="flex flex-wrap items-center gap-2 text-sm">
                <span className="font-medium">{topicLabel(n.topic as SafetyTopicKey)}</span>
                <StateBadge label={CHANGE_WORDS[n.change]} tone={n.change === "removed" ? "stop" : "caution"} />
                {n.waitBefore !== n.waitAfter ? (
                  <span className="font-mono text-xs">
                    wait {n.waitBefore ?? "—"} s → {n.waitAfter ?? "—"} s
                  </span>
                ) : null}
              </p>
              <LineDiffView lines={n.lines} label={`${topicLabel(n.topic as SafetyTopicKey)} note, approved and now`} />
            </div>
          ))}
        </Part>
      ) : null}
      {diff.checkpoints ? (
        <Part title="Bring-up checkpoints">
          <LineDiffView lines={diff.checkpoints} label="Checkpoints, approved and now" />
        </Part>
      ) : null}
      {diff.requirements ? (
        <Part title="Requirements for magnetics">
          <LineDiffView lines={diff.requirements} label="Requirements, approved and now" />
        </Part>
      ) : null}
    </div>
  );
}
