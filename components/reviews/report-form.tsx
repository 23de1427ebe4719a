"use client";

import { useActionState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { cx } from "@/components/ui/cx";
import { VERDICT_LABELS } from "@/lib/reviews/labels";
import type { FormResult } from "@/lib/validations/auth";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

export type ReportCheckpoint = { id: string; name: string; stageLabel: string; card: ReactNode };

// The word leads each choice; the tint of the checked one only backs it up.
const CHOICES = [
  { value: "fine", tone: "border-verdigris-300 has-[:checked]:bg-verdigris-50" },
  { value: "needs_attention", tone: "border-amber-300 has-[:checked]:bg-amber-50" },
  { value: "stop", tone: "border-signal-300 has-[:checked]:bg-signal-50" },
] as const;

/** A verdict and a comment per checkpoint in scope, beside its readings and photos; then the summary. */
export function ReportForm({ action, checkpoints }: { action: Action; checkpoints: ReportCheckpoint[] }) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  const values = failed?.values ?? {};
  const errors = failed?.fieldErrors ?? {};
  return (
    <form action={formAction} className="space-y-6" noValidate data-testid="report-form">
      <div key={JSON.stringify(values)} className="space-y-6">
        {checkpoints.map((c, index) => {
          const verdictError = errors[`verdict.${c.id}`];
          return (
            <fieldset key={c.id} className="space-y-3 rounded-md border border-graphite-200 p-4" data-testid="report-checkpoint" data-checkpoint-name={c.name}>
              <legend className="px-1 text-base font-semibold">
                <span className="figure font-mono text-graphite-600">{index + 1}.</span> {c.name} <span className="text-sm font-normal text-graphite-600">· {c.stageLabel}</span>
              </legend>
              <input type="hidden" name="checkpoint" value={c.id} />
              {c.card}
              <div role="radiogroup" aria-label={`Verdict for ${c.name}`} aria-describedby={verdictError ? `verdict-error-${c.id}` : undefined} className="flex flex-wrap gap-2">
                {CHOICES.map((choice) => (
                  <label key={choice.value} className={cx("flex cursor-pointer items-center gap-2 rounded border px-3 py-1.5 text-sm", choice.tone)}>
                    <input type="radio" name={`verdict.${c.id}`} value={choice.value} defaultChecked={values[`verdict.${c.id}`] === choice.value} className="accent-copper-600" />
                    <span>
                      <span className="font-semibold">{VERDICT_LABELS[choice.value].label}</span>{" "}
                      <span className="text-graphite-600">— {VERDICT_LABELS[choice.value].meaning.toLowerCase().replace(/\.$/, "")}</span>
                    </span>
                  </label>
                ))}
              </div>
              {verdictError ? (
                <p id={`verdict-error-${c.id}`} className="text-sm font-medium text-signal-700">
                  {verdictError.join(" ")}
                </p>
              ) : null}
              <TextArea
                name={`comment.${c.id}`}
                label={`Comment on ${c.name}`}
                hint="Required for “needs attention” and “stop”: what to look at or fix."
                rows={2}
                maxLength={2000}
                defaultValue={values[`comment.${c.id}`]}
                error={errors[`comment.${c.id}`]}
              />
            </fieldset>
          );
        })}
        <TextArea
          name="summaryMd"
          label="Summary"
          hint="Markdown. The overall picture and the order in which to fix things before the next power-up."
          rows={6}
          maxLength={10_000}
          required
          defaultValue={values.summaryMd}
          error={errors.summaryMd}
        />
      </div>
      <FormMessage tone="error" message={failed?.message} />
      <Button type="submit" disabled={pending}>
        {pending ? "Delivering…" : "Deliver the report"}
      </Button>
      <p className="text-sm text-graphite-600">Delivering charges the builder&apos;s held payment and sends your share to your payout account. It cannot be edited afterwards.</p>
    </form>
  );
}
