import type { ListingCheckpoint, ListingRequirement } from "@/db/schema";
import { Figure } from "@/components/ui/figure";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";

const STAGES: Record<string, string> = {
  "control-supply": "Control supply",
  "series-lamp": "Series lamp",
  "low-current": "Low current",
  "rated-load": "Rated load",
};

export function ListingCheckpoints({ rows }: { rows: ListingCheckpoint[] }) {
  if (rows.length === 0) return <p className="text-sm text-graphite-600">No bring-up checkpoints.</p>;
  return (
    <Table caption="Bring-up checkpoints">
      <THead>
        <TRow>
          <TH>Stage</TH>
          <TH>Checkpoint</TH>
          <TH>What to measure</TH>
          <TH numeric>Expected</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((c) => (
          <TRow key={c.id}>
            <TD>{STAGES[c.stage] ?? c.stage}</TD>
            <TD>{c.name}</TD>
            <TD>{c.measure}</TD>
            <TD numeric>
              {c.expectedMin} – {c.expectedMax} {c.unit}
            </TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}

export function ListingRequirements({ rows }: { rows: ListingRequirement[] }) {
  if (rows.length === 0) return <p className="text-sm text-graphite-600">No requirements for magnetics.</p>;
  return (
    <Table caption="What the kit needs of magnetics">
      <THead>
        <TRow>
          <TH>Part</TH>
          <TH>Kind</TH>
          <TH numeric>Minimum inductance</TH>
          <TH numeric>At current</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((r) => (
          <TRow key={r.id}>
            <TD>{r.label}</TD>
            <TD>{r.subtype}</TD>
            <TD numeric>{r.minInductanceH !== null ? <Figure value={r.minInductanceH} unit="H" /> : "—"}</TD>
            <TD numeric>{r.atCurrentA !== null ? <Figure value={r.atCurrentA} unit="A" /> : "—"}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
