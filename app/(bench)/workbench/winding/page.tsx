import type { Metadata } from "next";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { workbenchCalculator } from "@/components/workbench/calculators";
import { MethodNotes } from "@/components/workbench/method-notes";
import { WindingCalculator } from "@/components/workbench/winding-calculator";

const calculator = workbenchCalculator("winding");

export const metadata: Metadata = { title: calculator.title, description: calculator.question };

export default function WindingPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title={calculator.title}
        lede="The DC resistance of a winding at its working temperature, its copper loss and current density, and whether the strands are thin enough for the switching frequency."
      />
      <MainsCaution variant="full" />
      <WindingCalculator />
      <EstimateNote />
      <MethodNotes
        notes={[
          {
            rule: "R = ρ(T)·l / A with ρ(T) = ρ20·(1 + α·(T − 20 °C))",
            source: "annealed copper after IEC 60028, hard-drawn aluminium after IEC 60889",
          },
          {
            rule: "Skin depth δ = √(ρ / (π·f·μ0))",
            source: "Erickson & Maksimović, Fundamentals of Power Electronics, ch. 13",
          },
          { rule: "AWG diameter d = 0.127 mm × 92^((36 − n)/39)", source: "ASTM B258" },
        ]}
      />
    </div>
  );
}
