"use client";

import { useActionState } from "react";
import { requestSignInLink } from "@/app/(account)/sign-in/actions";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";

export function SignInForm({ next }: { next?: string }) {
  const [state, action, pending] = useActionState(requestSignInLink, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={action} className="space-y-4" noValidate>
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={failed?.values?.email ?? ""}
        error={failed?.fieldErrors.email}
        hint="We send a one-time link; no password to remember."
      />
      <FormMessage tone="error" message={failed && !failed.fieldErrors.email ? failed.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Sending the link…" : "E-mail me a sign-in link"}
      </Button>
    </form>
  );
}
