import type { Metadata } from "next";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { workbenchCalculator } from "@/components/workbench/calculators";
import { MethodNotes } from "@/components/workbench/method-notes";
import { WeldingOutputCalculator } from "@/components/workbench/welding-output-calculator";

const calculator = workbenchCalculator("welding-output");

export const metadata: Metadata = { title: calculator.title, description: calculator.question };

export default function WeldingOutputPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title={calculator.title}
        lede="Check a welding source's open-circuit voltage against the no-load limit for where it is used, see the load voltage it must hold across its output range, and convert its duty-cycle rating."
      />
      <MainsCaution variant="full" />
      <WeldingOutputCalculator />
      <EstimateNote />
      <MethodNotes
        notes={[
          {
            rule: "Conventional load lines and no-load voltage limits for each output kind and environment",
            source: "IEC 60974-1 (figures from memory; check the edition you build to)",
          },
          {
            rule: "Duty-cycle conversion by equal heating: I₂ = I₁·√(X₁ / X₂)",
            source: "IEC 60974-1 duty cycle over a 10-minute period",
          },
        ]}
      />
    </div>
  );
}
