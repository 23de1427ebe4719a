"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { FormResult } from "@/lib/validations/auth";
import type { ShopFieldName } from "@/lib/validations/sellers";
import { ShopFields } from "./shop-fields";

type Action = (previous: FormResult<ShopFieldName> | null, form: FormData) => Promise<FormResult<ShopFieldName>>;

/** The application to sell, or a directly appointed seller's shop: the same fields, different actions. */
export function ShopForm({ action, submitLabel, countries }: { action: Action; submitLabel: string; countries: { value: string; label: string }[] }) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : null;
  return (
    <form action={formAction} className="space-y-4" noValidate>
      {/* The key remounts the fields with what was sent, so a refused form keeps every value. */}
      <ShopFields key={JSON.stringify(failed?.values ?? {})} values={failed?.values ?? {}} errors={failed?.fieldErrors ?? {}} countries={countries} />
      <FormMessage tone={state?.ok ? "success" : "error"} message={state?.message} />
      <Button type="submit" disabled={pending}>
        {pending ? "Sending…" : submitLabel}
      </Button>
    </form>
  );
}
