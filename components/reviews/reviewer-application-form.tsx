"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import { EXPERTISE_AREAS } from "@/lib/validations/reviews";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

function first(errors: Partial<Record<string, string[]>> | undefined, key: string): string[] | undefined {
  return errors?.[key];
}

/** The application to review: areas, profile, track record, price per review in euros. */
export function ReviewerApplicationForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  const values = failed?.values ?? {};
  const chosen = new Set((values.expertise ?? "").split(",").filter(Boolean));
  const expertiseError = first(failed?.fieldErrors, "expertise");
  return (
    <form action={formAction} className="space-y-5" noValidate data-testid="reviewer-application-form">
      {/* The key remounts the fields with what was sent, so a refused form keeps every value. */}
      <div key={JSON.stringify(values)} className="space-y-5">
      <fieldset className="space-y-2" aria-describedby={expertiseError ? "expertise-error" : undefined}>
        <legend className="text-sm font-semibold text-graphite-900">Areas you know well</legend>
        <p className="text-sm text-graphite-600">Builders pick reviewers by these; choose the ones you have brought up yourself.</p>
        <div className="grid gap-2 sm:grid-cols-2">
          {EXPERTISE_AREAS.map((area) => (
            <label key={area.key} className="flex items-center gap-2 text-sm">
              <input type="checkbox" name="expertise" value={area.key} defaultChecked={chosen.has(area.key)} className="size-4 accent-copper-600" />
              {area.label}
            </label>
          ))}
        </div>
        {expertiseError ? (
          <p id="expertise-error" className="text-sm font-medium text-signal-700">
            {expertiseError.join(" ")}
          </p>
        ) : null}
      </fieldset>
      <TextArea
        name="profileMd"
        label="Profile"
        hint="Markdown. What builders read before booking you: what you build, how you review."
        rows={5}
        maxLength={4000}
        required
        defaultValue={values.profileMd}
        error={first(failed?.fieldErrors, "profileMd")}
      />
      <TextArea
        name="trackRecordMd"
        label="Track record"
        hint="Markdown. Builds you brought up, what you measured, what went wrong and how you found it. Moderators read this; it is not shown publicly."
        rows={6}
        maxLength={6000}
        required
        defaultValue={values.trackRecordMd}
        error={first(failed?.fieldErrors, "trackRecordMd")}
      />
      <TextField
        name="price"
        label="Price per review (EUR)"
        hint="What a builder pays for one review, e.g. 45.00. The platform fee comes out of it; the rest is yours."
        inputMode="decimal"
        className="max-w-40 font-mono"
        required
        defaultValue={values.price}
        error={first(failed?.fieldErrors, "price")}
      />
      </div>
      <FormMessage tone={state?.ok ? "success" : "error"} message={state?.message} />
      <Button type="submit" disabled={pending}>
        {pending ? "Sending…" : "Send the application"}
      </Button>
    </form>
  );
}
