import type { FormEvent, ReactNode } from "react";
import { FormMessage } from "@/components/ui/form-message";
import { Panel } from "@/components/ui/panel";

export interface CalculatorShellProps {
  inputs: ReactNode;
  /** the figures; replaced by `invalid` while the inputs do not validate */
  results: ReactNode;
  /** one line for the live region: the verdict, or what to fix */
  status?: string;
  statusTone?: "info" | "error";
  plotTitle?: string;
  plot?: ReactNode;
  /** reset control or other actions for the inputs panel */
  actions?: ReactNode;
}

// Results update as people type, so Enter in a field must not submit anything.
const stay = (event: FormEvent<HTMLFormElement>) => event.preventDefault();

/** Inputs on the left, results and the plot on the right; stacked on narrow screens. */
export function CalculatorShell({
  inputs,
  results,
  status,
  statusTone = "info",
  plotTitle,
  plot,
  actions,
}: CalculatorShellProps) {
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)] lg:items-start">
      <Panel title="Inputs" actions={actions}>
        <form noValidate onSubmit={stay} className="flex flex-col gap-4">
          {inputs}
        </form>
      </Panel>
      <div className="flex flex-col gap-6">
        <Panel title="Results">
          <FormMessage tone={statusTone} message={status} className="mb-3" />
          {results}
        </Panel>
        {plot != null ? <Panel title={plotTitle ?? "Plot"}>{plot}</Panel> : null}
      </div>
    </div>
  );
}
