import type { Metadata } from "next";
import Link from "next/link";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { WORKBENCH_CALCULATORS } from "@/components/workbench/calculators";

export const metadata: Metadata = {
  title: "Workbench",
  description:
    "Calculators for mains buses, bleeders, chokes, transformers, windings and welding outputs, with live results and plots.",
};

export default function WorkbenchPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title="Calculators for the bench"
        lede="Check a design's figures before you wind, build or list it. Results update as you type; nothing is sent or stored."
      />
      <MainsCaution variant="full" />
      <ul className="grid gap-4 md:grid-cols-2" aria-label="Calculators">
        {WORKBENCH_CALCULATORS.map((calculator) => (
          <li key={calculator.slug} className="rounded-md border border-graphite-200 bg-paper-raised p-4 shadow-sm">
            <h2 className="text-lg font-semibold">
              <Link href={calculator.href}>{calculator.title}</Link>
            </h2>
            <p className="mt-1 text-sm text-graphite-700">{calculator.question}</p>
          </li>
        ))}
      </ul>
      <EstimateNote />
    </div>
  );
}
