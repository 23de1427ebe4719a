"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { formatMoney } from "@/lib/format/money";
import type { FormResult } from "@/lib/validations/auth";

export type BookingLog = { id: string; title: string; stages: { stage: string; label: string; checkpoints: number }[] };
export type BookingReviewer = { id: string; name: string; priceMinor: number; currency: string; expertise: string };

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

/** Pick a log, a reviewer and the stages; the price is the reviewer's, shown before paying. */
export function BookingForm({
  action,
  logs,
  reviewers,
  initialLogId,
  initialReviewerId,
}: {
  action: Action;
  logs: BookingLog[];
  reviewers: BookingReviewer[];
  initialLogId?: string;
  initialReviewerId?: string;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  const [logId, setLogId] = useState(initialLogId && logs.some((l) => l.id === initialLogId) ? initialLogId : (logs[0]?.id ?? ""));
  const [reviewerId, setReviewerId] = useState(initialReviewerId && reviewers.some((r) => r.id === initialReviewerId) ? initialReviewerId : "");
  const log = logs.find((l) => l.id === logId);
  const reviewer = reviewers.find((r) => r.id === reviewerId);
  const stagesError = failed?.fieldErrors.stages;
  return (
    <form action={formAction} className="space-y-5" noValidate data-testid="booking-form">
      <SelectField
        name="logId"
        label="Bring-up log"
        value={logId}
        onChange={(e) => setLogId(e.target.value)}
        options={logs.map((l) => ({ value: l.id, label: l.title }))}
        error={failed?.fieldErrors.logId}
        required
      />
      <SelectField
        name="reviewerId"
        label="Reviewer"
        value={reviewerId}
        onChange={(e) => setReviewerId(e.target.value)}
        placeholder="Choose a reviewer"
        options={reviewers.map((r) => ({ value: r.id, label: `${r.name} — ${formatMoney(r.priceMinor, r.currency)}` }))}
        error={failed?.fieldErrors.reviewerId}
        required
      />
      {reviewer ? <p className="-mt-3 text-sm text-graphite-600">Knows: {reviewer.expertise}</p> : null}
      <fieldset className="space-y-2" aria-describedby={stagesError ? "stages-error" : "stages-hint"}>
        <legend className="text-sm font-semibold text-graphite-900">Stages to review</legend>
        <p id="stages-hint" className="text-sm text-graphite-600">
          The reviewer gives a verdict on every checkpoint of the stages you pick and sees the whole log.
        </p>
        {log?.stages.map((s) => (
          <label key={`${log.id}-${s.stage}`} className="flex items-center gap-2 text-sm">
            <input type="checkbox" name="stages" value={s.stage} disabled={s.checkpoints === 0} defaultChecked={s.checkpoints > 0} className="size-4 accent-copper-600" />
            {s.label}{" "}
            <span className="text-graphite-600">
              ({s.checkpoints} checkpoint{s.checkpoints === 1 ? "" : "s"})
            </span>
          </label>
        ))}
        {stagesError ? (
          <p id="stages-error" className="text-sm font-medium text-signal-700">
            {stagesError.join(" ")}
          </p>
        ) : null}
      </fieldset>
      <TextArea
        name="message"
        label="A note to the reviewer (optional)"
        hint="What worries you, what you have already tried. Up to 500 characters."
        rows={3}
        maxLength={500}
        error={failed?.fieldErrors.message}
      />
      <div className="rounded border border-graphite-200 bg-paper-sunken p-3 text-sm" data-testid="booking-price" aria-live="polite">
        {reviewer ? (
          <p>
            You pay <strong className="font-mono">{formatMoney(reviewer.priceMinor, reviewer.currency)}</strong>. It is held on your card now and
            charged only when {reviewer.name} delivers the report; it is released if they decline or do not answer within 48 hours.
          </p>
        ) : (
          <p>Choose a reviewer to see the price.</p>
        )}
      </div>
      <FormMessage tone="error" message={failed?.message} />
      <Button type="submit" disabled={pending || !reviewer || !log}>
        {pending ? "Opening the payment page…" : reviewer ? `Pay ${formatMoney(reviewer.priceMinor, reviewer.currency)} and send the request` : "Pay and send the request"}
      </Button>
    </form>
  );
}
