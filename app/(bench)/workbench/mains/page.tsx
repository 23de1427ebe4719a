import type { Metadata } from "next";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { workbenchCalculator } from "@/components/workbench/calculators";
import { MainsCalculator } from "@/components/workbench/mains-calculator";
import { MethodNotes } from "@/components/workbench/method-notes";

const calculator = workbenchCalculator("mains");

export const metadata: Metadata = { title: calculator.title, description: calculator.question };

export default function MainsBusPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title={calculator.title}
        lede="Rectified mains charges the bulk capacitors to the peak of the supply, and they keep that charge after the plug is pulled. Work out the peak, what the bus stores, and how long to wait before it is safe to touch."
      />
      <MainsCaution variant="full" />
      <MainsCalculator />
      <EstimateNote />
      <MethodNotes
        notes={[
          {
            rule: "Bus peak = √2 × Vrms × (1 + tolerance), at the top of the supply band",
            source: "nominal voltages and ±10 % band of IEC 60038",
          },
          { rule: "Stored energy ½·C·V², stored charge C·V at that peak", source: "capacitor energy and charge" },
          {
            rule: "Time to the safe level t = R·C·ln(V0 / 60 V)",
            source:
              "RC discharge; 60 V DC as the touch-safe limit of IEC 62368-1 (ES1) and IEC 61010-1, and 45 µC as the stored-charge limit of IEC 61010-1 (from memory)",
          },
          {
            rule: "Suggested bleeder: the largest E12 value that meets the target time, dissipating V0²/R",
            source: "E12 series of IEC 60063",
          },
        ]}
      />
    </div>
  );
}
