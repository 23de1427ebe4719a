import type { Metadata } from "next";
import { EstimateNote, MainsCaution } from "@/components/caution";
import { PageHeader } from "@/components/ui/page-header";
import { workbenchCalculator } from "@/components/workbench/calculators";
import { MethodNotes } from "@/components/workbench/method-notes";
import { TransformerCalculator } from "@/components/workbench/transformer-calculator";

const calculator = workbenchCalculator("transformer");

export const metadata: Metadata = { title: calculator.title, description: calculator.question };

export default function TransformerPage() {
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Workbench"
        title={calculator.title}
        lede="Primary turns from the EMF equation for sine or square drive, or from the volt-seconds of a forward converter, and the secondary turns for the output you need."
      />
      <MainsCaution variant="full" />
      <TransformerCalculator />
      <EstimateNote />
      <MethodNotes
        notes={[
          {
            rule: "V = Kf·f·N·Ae·B, with Kf = 4.44 for a sine (RMS volts) and 4.0 for a square wave (amplitude)",
            source: "McLyman, Transformer and Inductor Design Handbook, ch. 1",
          },
          {
            rule: "Forward converter: N = V·ton / (ΔB·Ae)",
            source: "Erickson & Maksimović, Fundamentals of Power Electronics, ch. 15",
          },
          { rule: "Turns are rounded up, so the flux never exceeds the figure you entered", source: "common practice" },
        ]}
      />
    </div>
  );
}
