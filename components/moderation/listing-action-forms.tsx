"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import { REASON_TOPICS } from "@/lib/validations/moderation";
import { reasonTopicLabel } from "./labels";

export type ModerationFormAction = (previous: FormResult | null, formData: FormData) => Promise<FormResult>;

const errorsOf = (state: FormResult | null, key: string): string[] | undefined =>
  state && !state.ok ? (state.fieldErrors as Record<string, string[] | undefined>)[key] : undefined;

/** What the person typed, echoed by the action, so React's reset after a refused submit does not wipe it. */
export const typed = (state: FormResult | null, key: string): string | undefined => (state && !state.ok ? state.values?.[key] : undefined);

function Result({ state }: { state: FormResult | null }) {
  return <FormMessage tone={state && !state.ok ? "error" : "info"} message={state && !state.ok ? state.message : undefined} />;
}

const TOPIC_OPTIONS = REASON_TOPICS.map((t) => ({ value: t, label: reasonTopicLabel(t) }));

export function ApproveForm({ action }: { action: ModerationFormAction }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-3" aria-label="Approve">
      <TextArea key={typed(state, "note")} name="note" label="Note to the seller (optional)" rows={2} maxLength={2000} defaultValue={typed(state, "note")} error={errorsOf(state, "note")} />
      <Result state={state} />
      <Button type="submit" disabled={pending}>
        {pending ? "Approving…" : "Approve: make it live"}
      </Button>
    </form>
  );
}

type Row = { key: number; topic: string; text: string };

/** One row per topic the moderator picks; "General" is for what is not about the sheet (photos, title, figures). */
export function SendBackForm({ action, suggestedTopics }: { action: ModerationFormAction; suggestedTopics: string[] }) {
  const [state, formAction, pending] = useActionState(action, null);
  const [rows, setRows] = useState<Row[]>(() => [{ key: 0, topic: suggestedTopics[0] ?? "", text: "" }]);
  const [nextKey, setNextKey] = useState(1);
  const used = new Set(rows.map((r) => r.topic));
  const update = (key: number, patch: Partial<Row>) => setRows((all) => all.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  return (
    <form action={formAction} className="space-y-4" aria-label="Send back">
      <p className="text-sm text-graphite-700">Give a reason per topic; the seller reads each one beside the part of the sheet it is about.</p>
      {rows.map((row, i) => (
        <fieldset key={row.key} className="space-y-2 rounded border border-graphite-200 p-3" data-testid={`reason-row-${i}`}>
          <legend className="px-1 text-sm font-semibold">Reason {i + 1}</legend>
          <SelectField
            name="reasonTopic"
            label="Topic"
            placeholder="Choose a topic"
            value={row.topic}
            onChange={(e) => update(row.key, { topic: e.target.value })}
            options={TOPIC_OPTIONS.map((o) => ({ ...o, disabled: o.value !== row.topic && used.has(o.value) }))}
            error={errorsOf(state, `reasons.${i}.topic`)}
          />
          <TextArea
            name="reasonText"
            label="What must change"
            rows={3}
            maxLength={2000}
            value={row.text}
            onChange={(e) => update(row.key, { text: e.target.value })}
            error={errorsOf(state, `reasons.${i}.text`)}
          />
          {rows.length > 1 ? (
            <Button variant="quiet" size="sm" onClick={() => setRows((all) => all.filter((r) => r.key !== row.key))}>
              Remove reason {i + 1}
            </Button>
          ) : null}
        </fieldset>
      ))}
      {rows.length < REASON_TOPICS.length ? (
        <Button
          variant="secondary"
          size="sm"
          onClick={() => {
            const free = suggestedTopics.find((t) => !used.has(t)) ?? "";
            setRows((all) => [...all, { key: nextKey, topic: free, text: "" }]);
            setNextKey((k) => k + 1);
          }}
        >
          Add another reason
        </Button>
      ) : null}
      <Result state={state} />
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? "Sending back…" : "Send back to the seller"}
      </Button>
    </form>
  );
}

export function HoldForm({ action }: { action: ModerationFormAction }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-3" aria-label="Hold">
      <TextArea
        key={typed(state, "reason")}
        defaultValue={typed(state, "reason")}
        name="reason"
        label="Why is it held?"
        hint="The listing leaves the catalog at once and its page says it is held. The seller reads this reason."
        rows={3}
        required
        maxLength={2000}
        error={errorsOf(state, "reason")}
      />
      <Result state={state} />
      <Button type="submit" variant="danger" disabled={pending}>
        {pending ? "Holding…" : "Hold the listing"}
      </Button>
    </form>
  );
}

export function RestoreForm({ action }: { action: ModerationFormAction }) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="space-y-3" aria-label="Restore">
      <TextArea key={typed(state, "note")} name="note" label="Note to the seller (optional)" rows={2} maxLength={2000} defaultValue={typed(state, "note")} error={errorsOf(state, "note")} />
      <Result state={state} />
      <Button type="submit" disabled={pending}>
        {pending ? "Restoring…" : "Restore: back in the catalog"}
      </Button>
    </form>
  );
}
