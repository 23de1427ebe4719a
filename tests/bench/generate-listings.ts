// One generated listing per row index: kind, state, seller, figures, text, photo, and a kit's
// checkpoints and requirements. Pure and seeded, so orders, posts and logs can look up the
// listing they refer to by index without reading it back from the database.
import { CURRENT_POLICY_REVISION, checkSafetySheet, type SafetyDeclaration, type SafetyNote } from "../../lib/policy";
import { deriveMagnetic } from "../../lib/listings/derived";
import type { MagneticFigures } from "../../lib/validations/listings";
import type { BringUpStage, ListingKind, ListingState, MagneticSubtype } from "../../db/schema/listings";
import { DEMO_LISTINGS } from "../../db/seed-listings";
import { benchUuid, rowRandom, type Rng } from "./support/random";
import {
  BOARD_TYPES,
  CHOKE_USES,
  CORE_SHAPES,
  CORE_SIZES,
  CT_USES,
  DESCRIPTION_SENTENCES,
  KIT_TITLES,
  MATERIAL_WORDS,
  SERIES,
  TRANSFORMER_USES,
  WIRE_WORDS,
  type KitType,
} from "./generate-words";

export const LISTING_STREAM = 1;
/** The demo seed's moment; generated activity lies in the two years before it. */
export const BASE_TIME = Date.UTC(2026, 8, 1, 9);
const DAY_MS = 86_400_000;

export type GeneratedCheckpoint = { id: string; position: number; stage: BringUpStage; name: string; measure: string; unit: string; min: number; max: number };
export type GeneratedRequirement = { id: string; subtype: MagneticSubtype; label: string; minInductanceH: number | null; atCurrentA: number | null };

export type GeneratedListing = {
  index: number;
  id: string;
  sellerIndex: number;
  kind: ListingKind;
  magneticSubtype: MagneticSubtype | null;
  title: string;
  slug: string;
  descriptionMd: string;
  priceMinor: number;
  stock: number;
  shippingWeightG: number;
  figures: MagneticFigures | Record<string, never>;
  declaration: SafetyDeclaration;
  notes: SafetyNote[];
  state: ListingState;
  inductanceH: number | null;
  ratedCurrentA: number | null;
  moderatorMessage: string | null;
  createdAt: Date;
  submittedAt: Date | null;
  liveAt: Date | null;
  photo: string | null;
  checkpoints: GeneratedCheckpoint[];
  requirements: GeneratedRequirement[];
};

export const PUBLIC_STATES: readonly ListingState[] = ["live", "held", "retired"];

/** Sellers grow with the catalog: about one per 500 listings, at least 20. */
export const sellersFor = (listings: number) => Math.max(20, Math.ceil(listings / 500));
/** Members (buyers, builders, askers): about one per 20 listings, at least 100. */
export const membersFor = (listings: number) => Math.max(100, Math.ceil(listings / 20));

// Safety sheets come from the demo listings whose sheets pass the current policy, so every
// generated live listing is one a moderator could have approved.
type SheetTemplate = { declaration: SafetyDeclaration; notes: SafetyNote[] };
const clearSheets = DEMO_LISTINGS.filter(
  (d) => checkSafetySheet({ declaration: d.declaration, notes: d.notes, revision: CURRENT_POLICY_REVISION }).status === "clear",
).map((d) => ({ kind: d.kind, sheet: { declaration: d.declaration, notes: d.notes } }));
const mainsSheets: SheetTemplate[] = clearSheets.filter((t) => t.sheet.declaration.mainsConnected).map((t) => t.sheet);
const lowVoltageSheets: SheetTemplate[] = clearSheets.filter((t) => !t.sheet.declaration.mainsConnected).map((t) => t.sheet);
if (mainsSheets.length === 0 || lowVoltageSheets.length === 0) {
  throw new Error("the generator needs at least one mains and one low-voltage demo listing with a clear safety sheet (db/seed-listings.ts)");
}

const significant = (value: number, digits = 2) => Number(value.toPrecision(digits));

export function slugify(text: string): string {
  return text
    .toLowerCase()
    .replaceAll("µ", "u")
    .replaceAll("–", "-")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "");
}

function magneticFigures(r: Rng, subtype: MagneticSubtype): MagneticFigures {
  const switchingFrequencyHz = r.pick([20e3, 25e3, 30e3, 40e3, 50e3, 65e3, 100e3]);
  const meanTurnLengthM = significant(r.between(0.06, 0.2), 3);
  if (subtype === "choke") {
    const coreMaterial = r.weighted({ "mnzn-ferrite": 60, "iron-powder": 25, nanocrystalline: 5, amorphous: 5, "silicon-steel": 5 });
    const ratedCurrentA = Math.round(r.logBetween(5, 160));
    const turns = r.int(5, 40);
    const powder = coreMaterial === "iron-powder";
    return {
      coreMaterial,
      coreAreaM2: significant(r.between(1e-4, 1.2e-3), 3),
      pathLengthM: significant(r.between(0.05, 0.2), 3),
      gapM: powder ? 0 : significant(coreMaterial === "mnzn-ferrite" ? r.between(0.5e-3, 4e-3) : r.between(0.2e-3, 2e-3), 2),
      ...(powder ? { alNh: Math.round(r.between(40, 300)) } : {}),
      meanTurnLengthM,
      // about 5 A/mm² at 80 % of the rated peak: common practice for a natural-convection winding
      windings: [{ name: "main", role: "winding", turns, material: "copper", areaM2: significant((0.8 * ratedCurrentA) / 5e6, 2), strands: r.pick([1, 1, 60, 120, 250, 400]), currentA: significant(0.8 * ratedCurrentA, 3) }],
      ratedCurrentA,
      switchingFrequencyHz,
    };
  }
  if (subtype === "transformer") {
    const primaryTurns = r.int(18, 60);
    const secondaryTurns = r.int(3, 12);
    const secondaryA = Math.round(r.between(30, 160));
    const primaryA = significant((secondaryA * secondaryTurns) / primaryTurns, 3);
    return {
      coreMaterial: "mnzn-ferrite",
      coreAreaM2: significant(r.between(2e-4, 1.1e-3), 3),
      pathLengthM: significant(r.between(0.08, 0.2), 3),
      gapM: 0,
      alNh: Math.round(r.between(2000, 8000)),
      meanTurnLengthM,
      windings: [
        { name: "primary", role: "primary", turns: primaryTurns, material: "copper", areaM2: significant(primaryA / 5e6, 2), strands: r.pick([60, 120, 200]), currentA: primaryA },
        { name: "secondary", role: "secondary", turns: secondaryTurns, material: "copper", areaM2: significant(secondaryA / 5e6, 2), strands: 1, currentA: secondaryA },
      ],
      ratedCurrentA: secondaryA,
      switchingFrequencyHz,
      primaryVoltageV: r.pick([155, 163, 170, 310, 325, 340]),
    };
  }
  const primaryA = Math.round(r.between(10, 60));
  const secondaryTurns = r.pick([50, 100, 150, 200]);
  return {
    coreMaterial: "mnzn-ferrite",
    coreAreaM2: significant(r.between(2e-5, 1.2e-4), 3),
    pathLengthM: significant(r.between(0.03, 0.08), 3),
    gapM: 0,
    alNh: Math.round(r.between(2000, 6000)),
    meanTurnLengthM: significant(r.between(0.02, 0.05), 3),
    windings: [
      { name: "primary", role: "primary", turns: 1, material: "copper", areaM2: significant(primaryA / 5e6, 2), strands: 1, currentA: primaryA },
      { name: "secondary", role: "secondary", turns: secondaryTurns, material: "copper", areaM2: 5e-8, strands: 1, currentA: significant(primaryA / secondaryTurns, 3) },
    ],
    ratedCurrentA: primaryA,
    switchingFrequencyHz,
  };
}

function fill(template: string, r: Rng): string {
  return template
    .replace("{f}", String(r.pick([20, 25, 30, 40, 50, 65, 100])))
    .replace("{strands}", String(r.pick([60, 120, 200, 400])))
    .replace("{kv}", r.pick(["2.5", "3", "4"]))
    .replace("{uf}", String(r.pick([470, 680, 1000, 1360, 2200])))
    .replace("{mm2}", String(r.pick([6, 10, 16, 25])))
    .replace("{creep}", String(r.pick([6, 8, 10])));
}

function sentences(r: Rng, count: number): string[] {
  const out = new Set<string>();
  while (out.size < count) out.add(fill(r.pick(DESCRIPTION_SENTENCES), r));
  return [...out];
}

function coreWords(r: Rng, material: string): string {
  const shape = r.pick(CORE_SHAPES);
  return `${r.pick(CORE_SIZES[shape])} ${MATERIAL_WORDS[material] ?? material}`;
}

const KIT_CHECKPOINTS: Record<KitType, Omit<GeneratedCheckpoint, "id" | "position">[]> = {
  welder: [
    { stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary", unit: "kHz", min: 38, max: 42 },
    { stage: "control-supply", name: "Control supply current", measure: "Current from the 15 V bench supply", unit: "mA", min: 80, max: 150 },
    { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the 100 W series lamp in circuit", unit: "V", min: 290, max: 335 },
    { stage: "series-lamp", name: "Open-circuit output", measure: "Voltage across the output terminals, no load", unit: "V", min: 55, max: 66 },
    { stage: "low-current", name: "Current-limit response", measure: "Output current into a 0.1 Ω load with the dial at minimum", unit: "A", min: 18, max: 30 },
    { stage: "rated-load", name: "Primary heatsink temperature", measure: "Heatsink temperature after 5 min at rated current", unit: "°C", min: 20, max: 75 },
  ],
  tig: [
    { stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary", unit: "kHz", min: 45, max: 55 },
    { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the series lamp in circuit", unit: "V", min: 290, max: 335 },
    { stage: "series-lamp", name: "Open-circuit output", measure: "Voltage across the output terminals, no load", unit: "V", min: 50, max: 70 },
    { stage: "low-current", name: "Minimum stable current", measure: "Output current with the dial at minimum", unit: "A", min: 5, max: 12 },
    { stage: "rated-load", name: "Output choke temperature", measure: "Choke surface temperature after 10 min at rated current", unit: "°C", min: 20, max: 90 },
  ],
  heater: [
    { stage: "control-supply", name: "Driver frequency", measure: "Frequency at the gate-drive output with no tank", unit: "kHz", min: 25, max: 35 },
    { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the series lamp in circuit", unit: "V", min: 290, max: 335 },
    { stage: "low-current", name: "Tank frequency", measure: "Resonant frequency of the work coil and capacitor bank", unit: "kHz", min: 26, max: 34 },
    { stage: "rated-load", name: "Input current with a workpiece", measure: "Mains current with the test bar in the coil", unit: "A", min: 6, max: 10 },
  ],
  supply: [
    { stage: "control-supply", name: "Reference voltage", measure: "Voltage at the reference test point", unit: "V", min: 4.9, max: 5.1 },
    { stage: "series-lamp", name: "Transformer secondary", measure: "AC voltage at the secondary, no load", unit: "V", min: 23, max: 27 },
    { stage: "low-current", name: "Output at full scale", measure: "Output voltage with the dial at maximum, no load", unit: "V", min: 58, max: 62 },
    { stage: "rated-load", name: "Output ripple", measure: "Ripple at rated current, peak to peak", unit: "mV", min: 0, max: 20 },
  ],
  charger: [
    { stage: "control-supply", name: "Control supply", measure: "Voltage at the controller supply pin", unit: "V", min: 11.5, max: 12.5 },
    { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the series lamp in circuit", unit: "V", min: 290, max: 335 },
    { stage: "low-current", name: "Float voltage", measure: "Output voltage in float, 12 V setting", unit: "V", min: 13.5, max: 13.8 },
    { stage: "rated-load", name: "Bulk charge current", measure: "Charge current into a discharged battery", unit: "A", min: 18, max: 21 },
  ],
  spot: [
    { stage: "control-supply", name: "Pulse timer", measure: "Pulse length at the gate with the dial at mid", unit: "ms", min: 8, max: 12 },
    { stage: "series-lamp", name: "Capacitor bank voltage", measure: "Bank voltage after charging behind the lamp", unit: "V", min: 22, max: 26 },
    { stage: "rated-load", name: "Pulse current", measure: "Peak current through the electrodes, measured with the shunt", unit: "A", min: 600, max: 900 },
  ],
};

function kitParts(r: Rng, index: number, type: KitType, amps: number) {
  const checkpoints = KIT_CHECKPOINTS[type].map((c, position) => {
    // sellers state slightly different ranges for their own builds
    const spread = (c.max - c.min) * r.between(-0.05, 0.05);
    return { ...c, id: benchUuid("b3000000", index * 8 + position), position, min: significant(c.min + spread, 3), max: significant(c.max + spread, 3) };
  });
  const need: Omit<GeneratedRequirement, "id">[] = [];
  if (type === "welder" || type === "tig") {
    need.push({ subtype: "choke", label: "Output choke", minInductanceH: significant(r.between(10e-6, 40e-6), 2), atCurrentA: Math.round(amps * 0.7) });
    need.push({ subtype: "transformer", label: "Main transformer", minInductanceH: null, atCurrentA: Math.round(amps * 0.7) });
    if (r.chance(0.6)) need.push({ subtype: "current-transformer", label: "Current-sense transformer", minInductanceH: null, atCurrentA: null });
  } else if (type === "heater") {
    need.push({ subtype: "transformer", label: "Matching transformer", minInductanceH: null, atCurrentA: Math.round(r.between(40, 80)) });
  } else if (type === "supply" || type === "charger") {
    need.push({ subtype: "choke", label: "Buck choke", minInductanceH: significant(r.between(30e-6, 200e-6), 2), atCurrentA: Math.round(r.between(5, 25)) });
  }
  return { checkpoints, requirements: need.map((n, k) => ({ ...n, id: benchUuid("b3100000", index * 4 + k) })) };
}

const PHOTOS: Record<string, string> = {
  choke: "choke-output",
  transformer: "transformer-main",
  "current-transformer": "ct-current-sense",
  board: "board-gate-drive",
  "board-supply": "board-bench-supply",
  welder: "kit-stick-welder",
  heater: "kit-induction-heater",
};

export function listingSpec(index: number): GeneratedListing {
  const r = rowRandom(LISTING_STREAM, index);
  const kind = r.weighted<ListingKind>({ magnetic: 50, board: 25, kit: 25 });
  const state = r.weighted<ListingState>({ live: 86, in_review: 4, draft: 3, sent_back: 2, held: 2, retired: 3 });
  const sellerIndex = r.int(0, Math.max(19, Math.floor(index / 500)));
  const series = r.pick(SERIES);
  let magneticSubtype: MagneticSubtype | null = null;
  let title: string;
  let lead: string;
  let facts: string[] = [];
  let figures: GeneratedListing["figures"] = {};
  let sheet: SheetTemplate;
  let inductanceH: number | null = null;
  let ratedCurrentA: number | null = null;
  let photo: string;
  let parts: ReturnType<typeof kitParts> = { checkpoints: [], requirements: [] };
  let priceMinor: number;
  let shippingWeightG: number;

  if (kind === "magnetic") {
    magneticSubtype = r.weighted<MagneticSubtype>({ choke: 40, transformer: 40, "current-transformer": 20 });
    const f = magneticFigures(r, magneticSubtype);
    figures = f;
    inductanceH = deriveMagnetic(magneticSubtype, f).inductanceH;
    ratedCurrentA = f.ratedCurrentA;
    const core = coreWords(r, f.coreMaterial);
    const wire = r.pick(WIRE_WORDS);
    const kHz = f.switchingFrequencyHz / 1000;
    const [primary, secondary] = f.windings;
    if (magneticSubtype === "choke") {
      const use = r.pick(CHOKE_USES);
      title = `${series} ${use} ${significant(inductanceH * 1e6)} µH / ${f.ratedCurrentA} A, ${core}`;
      lead = `A ${use} wound on ${core} with ${wire}, for ${kHz} kHz converters.`;
    } else if (magneticSubtype === "transformer") {
      const use = r.pick(TRANSFORMER_USES);
      title = `${series} ${use} ${primary?.turns}:${secondary?.turns}, ${kHz} kHz, ${core}`;
      lead = `A ${use} on ${core}, primary and secondary in ${wire}, for a ${f.primaryVoltageV} V square wave at ${kHz} kHz.`;
    } else {
      const use = r.pick(CT_USES);
      title = `${series} ${use} 1:${secondary?.turns}, ${f.ratedCurrentA} A, ${core}`;
      lead = `A ${use} for cycle-by-cycle current limiting: one primary turn, ${secondary?.turns} secondary turns on ${core}.`;
    }
    facts = [`Inductance ${significant(inductanceH * 1e6, 3)} µH`, `Rated current ${f.ratedCurrentA} A`, `Switching frequency ${kHz} kHz`];
    sheet = r.pick(lowVoltageSheets);
    photo = PHOTOS[magneticSubtype] ?? "choke-output";
    priceMinor = Math.round(r.logBetween(800, 12_000) / 50) * 50;
    shippingWeightG = r.int(100, 2000);
  } else if (kind === "board") {
    const type = r.pick(BOARD_TYPES);
    const bus = r.pick([170, 325, 340, 400]);
    const amps = r.pick([80, 120, 160, 200, 250]);
    title = r.chance(0.5) ? `${series} ${type}, ${bus} V bus` : `${series} ${type} for ${amps} A welders`;
    lead = `A ${type} for home-built inverters on a ${bus} V bus.`;
    facts = [`Bus ${bus} V`, `Rated ${amps} A output`];
    sheet = r.chance(0.4) ? r.pick(mainsSheets) : r.pick(lowVoltageSheets);
    photo = type.includes("supply") || type.includes("charger") ? PHOTOS["board-supply"]! : PHOTOS.board!;
    priceMinor = Math.round(r.logBetween(1500, 25_000) / 50) * 50;
    shippingWeightG = r.int(100, 800);
  } else {
    const type = r.weighted<KitType>({ welder: 35, tig: 15, heater: 15, supply: 15, charger: 12, spot: 8 });
    const amps = r.pick([120, 140, 160, 180, 200, 250]);
    title = `${series} ${r
      .pick(KIT_TITLES[type])
      .replace("{A}", String(amps))
      .replace("{P}", String(r.pick([1, 2, 3, 5])))
      .replace("{V}", String(r.pick([30, 40, 60])))
      .replace("{I}", String(r.pick([5, 10, 20, 30])))}`;
    lead = `A complete kit: boards, heatsinks, case parts and a wiring loom, with bring-up checkpoints for each stage.`;
    facts = [`Rated ${amps} A`, `Mains 230 V`];
    sheet = r.pick(mainsSheets);
    parts = kitParts(r, index, type, amps);
    photo = type === "heater" ? PHOTOS.heater! : type === "supply" || type === "charger" ? PHOTOS["board-supply"]! : PHOTOS.welder!;
    priceMinor = Math.round(r.logBetween(6000, 90_000) / 50) * 50;
    shippingWeightG = r.int(1500, 9000);
  }

  const body = sentences(r, r.int(3, 6));
  const descriptionMd = `${lead} ${body.slice(0, 2).join(" ")}\n\n${facts.map((f) => `- ${f}`).join("\n")}\n\n${body.slice(2).join(" ")}`;
  const createdAt = new Date(BASE_TIME - Math.round(r.between(5, 730) * DAY_MS));
  const submitted = state !== "draft";
  const wentLive = PUBLIC_STATES.includes(state);
  return {
    index,
    id: benchUuid("b1000000", index),
    sellerIndex,
    kind,
    magneticSubtype,
    title,
    slug: `${slugify(title)}-${index.toString(36)}`,
    descriptionMd,
    priceMinor,
    stock: r.chance(0.1) ? 0 : r.int(1, 40),
    shippingWeightG,
    figures,
    declaration: sheet.declaration,
    notes: sheet.notes,
    state,
    inductanceH,
    ratedCurrentA,
    moderatorMessage: state === "held" ? "Held while the seller confirms the insulation rating between windings." : state === "sent_back" ? "Say which parts are bonded to earth and how to check them." : null,
    createdAt,
    submittedAt: submitted ? new Date(createdAt.getTime() + DAY_MS) : null,
    liveAt: wentLive ? new Date(createdAt.getTime() + 2 * DAY_MS) : null,
    photo: state === "draft" && r.chance(0.5) ? null : photo,
    checkpoints: parts.checkpoints,
    requirements: parts.requirements,
  };
}

/** The nearest listing at or below `index` (else above, below `limit`) that matches; for orders, posts and logs. */
export function nearestListing(index: number, limit: number, matches: (l: GeneratedListing) => boolean): GeneratedListing | null {
  for (let i = Math.min(index, limit - 1); i >= 0; i--) {
    const l = listingSpec(i);
    if (matches(l)) return l;
  }
  for (let i = index + 1; i < limit; i++) {
    const l = listingSpec(i);
    if (matches(l)) return l;
  }
  return null;
}
