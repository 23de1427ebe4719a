import { ElectricityWarningSign } from "@/components/caution";
import { Alert } from "@/components/ui/alert";
import type { ReadingCaution as Caution } from "@/lib/bench/cautions";

/** The caution beside a reading far outside its range; the warning sign where mains or stored charge is the danger. */
export function ReadingCaution({ caution }: { caution: Caution }) {
  const electrical = caution.kind !== "control-supply";
  return (
    <Alert
      tone="stop"
      role="none"
      className="mt-2"
      title={
        <span className="inline-flex items-center gap-2">
          {electrical ? <ElectricityWarningSign size={20} /> : null}
          {caution.title}
        </span>
      }
    >
      <p data-testid="reading-caution" data-caution={caution.kind}>
        {caution.text}
      </p>
    </Alert>
  );
}
