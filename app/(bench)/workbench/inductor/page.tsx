import type { Metadata } from "next";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { workbenchCalculator } from "@/components/workbench/calculators";
import { InductorCalculator } from "@/components/workbench/inductor-calculator";
import { MethodNotes } from "@/components/workbench/method-notes";

const calculator = workbenchCalculator("inductor");

export const metadata: Metadata = { title: calculator.title, description: calculator.question };

export default function InductorPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title={calculator.title}
        lede="For an output choke or any gapped inductor: the inductance from the core's AL value or from its gap, the peak flux density at the rated current, and the room left before the core saturates."
      />
      <MainsCaution variant="full" />
      <InductorCalculator />
      <EstimateNote />
      <MethodNotes
        notes={[
          {
            rule: "L = AL × N², or L = μ0·N²·Ae / (lg + le/μr) for a gapped core",
            source: "Erickson & Maksimović, Fundamentals of Power Electronics, ch. 13",
          },
          { rule: "Peak flux density B = L·I / (N·Ae); stored energy ½·L·I²", source: "from N·Φ = L·I" },
          {
            rule: "Margins against the material's design maximum and the lower end of its saturation range",
            source: "typical datasheet ranges as tabulated by McLyman (from memory); design maxima are common practice",
          },
        ]}
      />
    </div>
  );
}
