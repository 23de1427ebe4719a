import type { BringUpStage, ListingKind } from "@/db/schema/listings";

const KIND_LABELS: Record<ListingKind, string> = { board: "Board", magnetic: "Magnetic", kit: "Kit" };
const SUBTYPE_LABELS: Record<string, string> = { transformer: "Transformer", choke: "Choke", "current-transformer": "Current transformer" };

export function kindLabel(kind: ListingKind, subtype?: string | null): string {
  return kind === "magnetic" && subtype ? `Magnetic · ${SUBTYPE_LABELS[subtype] ?? subtype}` : KIND_LABELS[kind];
}

export function subtypeLabel(subtype: string): string {
  return SUBTYPE_LABELS[subtype] ?? subtype;
}

/** Bring-up stages in the order of a careful first power-up. */
export const STAGE_LABELS: Record<BringUpStage, string> = {
  "control-supply": "Control supply only",
  "series-lamp": "First mains power through a series lamp",
  "low-current": "Low-current load",
  "rated-load": "Rated load",
};
