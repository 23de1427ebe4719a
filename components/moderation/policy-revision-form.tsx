"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { NumberField, TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import { typed, type ModerationFormAction } from "./listing-action-forms";

export type PolicyFormDefaults = {
  minWords: number;
  topicMinWords: Record<string, number | undefined>;
  safeVoltageV: number;
  storedChargeThresholdMicroC: number;
  waitMarginFactor: number;
  graceDays: number;
};

/** A new revision, starting from the rules in force; per-topic minimums left blank use the general one. */
export function PolicyRevisionForm({
  action,
  defaults,
  topics,
  nextRevision,
}: {
  action: ModerationFormAction;
  defaults: PolicyFormDefaults;
  topics: { key: string; label: string }[];
  nextRevision: number;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  const errors = (key: string) => (state && !state.ok ? (state.fieldErrors as Record<string, string[] | undefined>)[key] : undefined);
  // After a refused submit the fields start from what was typed, not from the rules in force.
  const value = <T,>(key: string, fallback: T): string | T => typed(state, key) ?? fallback;
  return (
    <form action={formAction} className="space-y-5" aria-label="Publish a policy revision">
      {/* Keyed so the fields re-mount with the echoed values; the live region below stays mounted so it is announced. */}
      <div key={state && !state.ok ? JSON.stringify(state.values ?? {}) : "defaults"} className="space-y-5">
        <TextArea name="summary" defaultValue={value("summary", "")} label="What changes" hint="One or two sentences; sellers read this in their notice." rows={2} required maxLength={1000} error={errors("summary")} />
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <NumberField name="minWords" label="Minimum words per note" defaultValue={value("minWords", defaults.minWords)} min={1} max={1000} step={1} required error={errors("minWords")} />
          <NumberField name="safeVoltageV" label="Safe voltage" unit="V" defaultValue={value("safeVoltageV", defaults.safeVoltageV)} min={1} max={1000} required error={errors("safeVoltageV")} />
          <NumberField
            name="storedChargeThresholdMicroC"
            label="Stored-charge threshold"
            unit="µC"
            hint="Above this charge (and the safe voltage) the stored-charge topic is required."
            defaultValue={value("storedChargeThresholdMicroC", defaults.storedChargeThresholdMicroC)}
            min={0}
            required
            error={errors("storedChargeThresholdMicroC")}
          />
          <NumberField
            name="waitMarginFactor"
            label="Wait margin factor"
            hint="1.5 means the stated wait must be at least 1.5 × the computed discharge time."
            defaultValue={value("waitMarginFactor", defaults.waitMarginFactor)}
            min={1}
            max={100}
            required
            error={errors("waitMarginFactor")}
          />
          <NumberField
            name="graceDays"
            label="Grace period"
            unit="days"
            hint="How long a live listing that fails the new revision stays up before it is held."
            defaultValue={value("graceDays", defaults.graceDays)}
            min={1}
            max={365}
            step={1}
            required
            error={errors("graceDays")}
          />
        </div>
        <fieldset className="space-y-3">
          <legend className="font-semibold">Minimum words per topic</legend>
          <p className="text-sm text-graphite-600">Leave blank to use the general minimum.</p>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {topics.map((t) => (
              <NumberField
                key={t.key}
                name={`topicMinWords.${t.key}`}
                label={t.label}
                defaultValue={value(`topicMinWords.${t.key}`, defaults.topicMinWords[t.key] ?? "")}
                min={1}
                max={1000}
                step={1}
                error={errors(`topicMinWords.${t.key}`)}
              />
            ))}
          </div>
        </fieldset>
      </div>
      <FormMessage tone="error" message={state && !state.ok ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Publishing…" : `Publish revision ${nextRevision} and re-check live listings`}
      </Button>
    </form>
  );
}
