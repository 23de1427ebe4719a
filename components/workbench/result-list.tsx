import type { ReactNode } from "react";
import { cx } from "@/components/ui/cx";
import { StateBadge } from "@/components/ui/state-badge";

export type ResultTone = "clear" | "caution" | "stop";

/** A verdict beside a figure: always a word, the tone only backs it up. */
export interface ResultStatus {
  word: string;
  tone: ResultTone;
}

const VALUE_TONES: Record<ResultTone, string> = {
  clear: "text-verdigris-700",
  caution: "text-amber-700",
  stop: "text-signal-700",
};

export function ResultList({ children, className }: { children: ReactNode; className?: string }) {
  return <dl className={cx("divide-y divide-graphite-100", className)}>{children}</dl>;
}

export interface ResultRowProps {
  label: ReactNode;
  /** usually a <Figure>; the row colours it when `status` is given */
  value: ReactNode;
  status?: ResultStatus | null;
  note?: ReactNode;
}

export function ResultRow({ label, value, status, note }: ResultRowProps) {
  return (
    <div className="grid grid-cols-[minmax(0,1fr)_auto] items-baseline gap-x-4 gap-y-1 py-2" data-tone={status?.tone}>
      <dt className="text-sm text-graphite-700">{label}</dt>
      <dd
        className={cx(
          "flex flex-wrap items-baseline justify-end gap-2 text-right text-lg",
          status && VALUE_TONES[status.tone],
        )}
      >
        {value}
        {status ? <StateBadge label={status.word} tone={status.tone} /> : null}
      </dd>
      {note != null ? <dd className="col-span-2 text-sm text-graphite-600">{note}</dd> : null}
    </div>
  );
}
