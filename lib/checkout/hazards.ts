// What a buyer acknowledges before paying for a mains-connected item: the hazards its own
// declaration implies, in words, with the revision of the sheet they read.
import { hazardProfile, type PolicyRevision, type SafetyDeclaration } from "@/lib/policy";
import { joules, seconds, volts } from "@/lib/policy/format";

/** Small energies read better in millijoules ("0.64 mJ", not "0.00064 J"). */
function energy(j: number): string {
  return j >= 1 ? joules(j) : `${Number((j * 1000).toPrecision(3))} mJ`;
}

export type AcknowledgedItem = {
  kind: "board" | "magnetic" | "kit";
  magneticSubtype: string | null;
  declaration: SafetyDeclaration;
  sheetRevision: number;
};

const SUBTYPE_NOUNS: Record<string, string> = { transformer: "transformer", choke: "choke", "current-transformer": "current transformer" };

function noun(item: Pick<AcknowledgedItem, "kind" | "magneticSubtype">): string {
  if (item.kind === "magnetic") return (item.magneticSubtype && SUBTYPE_NOUNS[item.magneticSubtype]) || "part";
  return item.kind;
}

/** Only mains-connected items need an acknowledgement; the rest never touch the bus. */
export function needsAcknowledgement(declaration: SafetyDeclaration): boolean {
  return declaration.mainsConnected === true;
}

/**
 * The hazards as short clauses, e.g. ["connects to 230 V mains", "its bus reaches 358 V and
 * stores 64 J", "heatsinks are live"]; stored with the acknowledgement so the order shows what
 * the buyer agreed to even after the sheet changes.
 */
export function acknowledgementHazards(declaration: SafetyDeclaration, revision?: PolicyRevision): string[] {
  if (!needsAcknowledgement(declaration)) return [];
  const profile = hazardProfile(declaration, revision);
  const hazards = [`connects to ${volts(declaration.mainsVrms ?? 0)} mains`];
  if (profile.busPeakV > 0) {
    hazards.push(profile.storedEnergyJ > 0 ? `its bus reaches ${volts(profile.busPeakV)} and stores ${energy(profile.storedEnergyJ)}` : `its bus reaches ${volts(profile.busPeakV)}`);
  }
  // The wait matters only where the charge is worth fearing, the same test the policy uses.
  if (profile.requiredTopics.includes("stored-charge")) {
    hazards.push(
      profile.dischargeS === null
        ? "it has no bleeder, so the bus must be discharged by hand"
        : `the bus needs ${seconds(profile.dischargeS)} to fall below ${volts(profile.safeVoltageV)} after unplugging`,
    );
  }
  if (declaration.liveHeatsinks) hazards.push("heatsinks are live");
  if (declaration.weldingSource) {
    hazards.push(
      declaration.openCircuitV !== undefined
        ? `it is a welding source with ${volts(declaration.openCircuitV)} open-circuit output`
        : "it is a welding source",
    );
  }
  return hazards;
}

/** The checkbox label: "This kit connects to 230 V mains; …. I have read its safety sheet (revision 3)." */
export function acknowledgementText(item: Pick<AcknowledgedItem, "kind" | "magneticSubtype" | "sheetRevision">, hazards: readonly string[]): string {
  const lead = `This ${noun(item)}`;
  const body = hazards.length > 0 ? `${lead} ${hazards.join("; ")}.` : `${lead} connects to mains.`;
  return `${body} I have read its safety sheet (revision ${item.sheetRevision}).`;
}
