import type { ReactNode } from "react";

export interface MethodNote {
  /** the formula or rule, as a reader would write it */
  rule: ReactNode;
  /** where it comes from */
  source: ReactNode;
}

/** "How the figures are worked out": each rule with its source, so a result can be checked by hand. */
export function MethodNotes({ notes }: { notes: readonly MethodNote[] }) {
  return (
    <section aria-labelledby="method-heading" className="max-w-reading">
      <h2 id="method-heading" className="text-lg font-semibold text-graphite-900">
        How the figures are worked out
      </h2>
      <ul className="mt-2 list-disc space-y-1.5 pl-5 text-sm text-graphite-700">
        {notes.map((note, i) => (
          <li key={i}>
            {note.rule} <span className="text-graphite-600">— {note.source}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
