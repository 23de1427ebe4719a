import { expertiseLabel } from "@/lib/validations/reviews";

export function ExpertiseTags({ expertise }: { expertise: readonly string[] }) {
  return (
    <ul className="flex flex-wrap gap-1.5" aria-label="Areas of expertise">
      {expertise.map((key) => (
        <li key={key} className="rounded-sm border border-graphite-300 bg-paper-sunken px-1.5 py-px text-xs font-medium text-graphite-700">
          {expertiseLabel(key)}
        </li>
      ))}
    </ul>
  );
}
