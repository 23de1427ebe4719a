/**
 * Which kits a magnetic fits: a kit states what it needs ("output choke ≥ 40 µH at 120 A"), a
 * magnetic listing has a subtype, a derived inductance and a rated current. Pure; SI.
 */
import type { MagneticSubtype } from "@/db/schema/listings";

export interface MagneticOffer {
  subtype: MagneticSubtype;
  /** null when the figures are not complete enough to derive it */
  inductanceH: number | null;
  ratedCurrentA: number | null;
}

export interface KitRequirement {
  subtype: MagneticSubtype;
  label: string;
  minInductanceH: number | null;
  atCurrentA: number | null;
}

export type FitVerdict = { fits: true } | { fits: false; because: "subtype" | "inductance" | "current" | "unknown-figures" };

// Figures travel through JSON and a double-precision column; a value typed as exactly the
// requirement must not fail on the last bit.
const RELATIVE_SLACK = 1e-9;
const atLeast = (value: number, min: number) => value >= min * (1 - RELATIVE_SLACK);

/** A magnetic fits a requirement when the subtype matches, L ≥ the minimum and the rated current ≥ the stated current. */
export function fitsRequirement(offer: MagneticOffer, requirement: KitRequirement): FitVerdict {
  if (offer.subtype !== requirement.subtype) return { fits: false, because: "subtype" };
  if (requirement.minInductanceH !== null) {
    if (offer.inductanceH === null) return { fits: false, because: "unknown-figures" };
    if (!atLeast(offer.inductanceH, requirement.minInductanceH)) return { fits: false, because: "inductance" };
  }
  if (requirement.atCurrentA !== null) {
    if (offer.ratedCurrentA === null) return { fits: false, because: "unknown-figures" };
    if (!atLeast(offer.ratedCurrentA, requirement.atCurrentA)) return { fits: false, because: "current" };
  }
  return { fits: true };
}

/** The kits (with the requirement each one matched) that a magnetic fits; a kit appears once. */
export function kitsFittedBy<K extends { requirements: readonly KitRequirement[] }>(
  offer: MagneticOffer,
  kits: readonly K[],
): { kit: K; requirement: KitRequirement }[] {
  const out: { kit: K; requirement: KitRequirement }[] = [];
  for (const kit of kits) {
    const matched = kit.requirements.find((r) => fitsRequirement(offer, r).fits);
    if (matched) out.push({ kit, requirement: matched });
  }
  return out;
}
