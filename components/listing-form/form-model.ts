/**
 * The listing form's values as typed (text in practical units: µH, mm², kHz, µF, kΩ, %), and their
 * conversion to the SI input of lib/validations/listings.ts. Error paths of the schema are the
 * form's own field names, so an error lands beside the input it is about. Pure: runs on every change.
 */
import { issueMessage, readNumber, type NumberSpec } from "@/components/workbench/live-input";
import type { PhotoValue } from "@/components/uploads/photo-uploader";
import type { DocumentValue } from "@/components/uploads/document-uploader";
import type { BringUpStage, ListingKind, MagneticSubtype } from "./types";
import { SAFETY_TOPIC_KEYS, type SafetyTopicKey } from "@/lib/policy/topics";
import { listingDraftSchema, minorToPriceText, type Currency, type ListingDraftInput, type WindingRole } from "@/lib/validations/listings";

export type { DocumentValue, PhotoValue };

export type WindingValues = { name: string; role: WindingRole; turns: string; material: string; areaM2: string; strands: string; currentA: string };
export type CheckpointValues = { stage: BringUpStage; name: string; measure: string; unit: string; expectedMin: string; expectedMax: string };
export type RequirementValues = { subtype: MagneticSubtype; label: string; minInductanceH: string; atCurrentA: string };

export type FormValues = {
  kind: ListingKind;
  magneticSubtype: MagneticSubtype;
  title: string;
  descriptionMd: string;
  price: string;
  currency: Currency;
  stock: string;
  shippingWeightG: string;
  photos: PhotoValue[];
  documents: DocumentValue[];
  figures: {
    coreMaterial: string;
    coreAreaM2: string;
    pathLengthM: string;
    gapM: string;
    alNh: string;
    meanTurnLengthM: string;
    ratedCurrentA: string;
    switchingFrequencyHz: string;
    primaryVoltageV: string;
    windings: WindingValues[];
  };
  declaration: {
    mainsConnected: boolean;
    mainsVrms: string;
    mainsTolerance: string;
    busCapacitanceF: string;
    bleederOhm: string;
    liveHeatsinks: boolean;
    weldingSource: boolean;
    openCircuitV: string;
    ocvKind: "dc" | "ac";
    environment: "normal" | "increased-hazard";
  };
  notes: Record<SafetyTopicKey, { text: string; waitSeconds: string }>;
  checkpoints: CheckpointValues[];
  requirements: RequirementValues[];
};

/** How each typed figure becomes SI; keys are schema paths with `*` for a row index. */
export const SPECS: Record<string, NumberSpec> = {
  stock: { label: "Stock", unit: "", toSi: 1 },
  shippingWeightG: { label: "Shipping weight", unit: "g", toSi: 1 },
  "figures.coreAreaM2": { label: "Core area Ae", unit: "mm²", toSi: 1e-6 },
  "figures.pathLengthM": { label: "Path length le", unit: "mm", toSi: 1e-3 },
  "figures.gapM": { label: "Air gap lg", unit: "mm", toSi: 1e-3 },
  "figures.alNh": { label: "AL", unit: "nH", toSi: 1 },
  "figures.meanTurnLengthM": { label: "Mean turn length", unit: "mm", toSi: 1e-3 },
  "figures.ratedCurrentA": { label: "Rated current", unit: "A", toSi: 1 },
  "figures.switchingFrequencyHz": { label: "Switching frequency", unit: "kHz", toSi: 1e3 },
  "figures.primaryVoltageV": { label: "Primary voltage", unit: "V", toSi: 1 },
  "figures.windings.*.turns": { label: "Turns", unit: "", toSi: 1 },
  "figures.windings.*.areaM2": { label: "Conductor cross-section", unit: "mm²", toSi: 1e-6 },
  "figures.windings.*.strands": { label: "Strands", unit: "", toSi: 1 },
  "figures.windings.*.currentA": { label: "Winding current", unit: "A", toSi: 1 },
  "declaration.mainsVrms": { label: "Mains voltage", unit: "V", toSi: 1 },
  "declaration.mainsTolerance": { label: "Mains tolerance", unit: "%", toSi: 0.01 },
  "declaration.busCapacitanceF": { label: "Bus capacitance", unit: "µF", toSi: 1e-6 },
  "declaration.bleederOhm": { label: "Bleeder resistance", unit: "kΩ", toSi: 1e3 },
  "declaration.openCircuitV": { label: "Open-circuit voltage", unit: "V", toSi: 1 },
  "notes.*.waitSeconds": { label: "Wait", unit: "s", toSi: 1 },
  "checkpoints.*.expectedMin": { label: "Lowest expected reading", unit: "", toSi: 1 },
  "checkpoints.*.expectedMax": { label: "Highest expected reading", unit: "", toSi: 1 },
  "requirements.*.minInductanceH": { label: "Minimum inductance", unit: "µH", toSi: 1e-6 },
  "requirements.*.atCurrentA": { label: "Current", unit: "A", toSi: 1 },
};

export function specFor(path: string): NumberSpec | undefined {
  return SPECS[path.replace(/\.\d+(?=\.|$)/g, ".*")];
}

function emptyNotes(): FormValues["notes"] {
  return Object.fromEntries(SAFETY_TOPIC_KEYS.map((t) => [t, { text: "", waitSeconds: "" }])) as FormValues["notes"];
}

export function emptyWinding(role: WindingRole = "winding"): WindingValues {
  return { name: role === "winding" ? "main" : role, role, turns: "", material: "copper", areaM2: "", strands: "1", currentA: "" };
}

export function emptyCheckpoint(): CheckpointValues {
  return { stage: "control-supply", name: "", measure: "", unit: "V", expectedMin: "", expectedMax: "" };
}

export function emptyRequirement(): RequirementValues {
  return { subtype: "choke", label: "", minInductanceH: "", atCurrentA: "" };
}

export function defaultValues(kind: ListingKind = "kit"): FormValues {
  return {
    kind,
    magneticSubtype: "choke",
    title: "",
    descriptionMd: "",
    price: "",
    currency: "EUR",
    stock: "1",
    shippingWeightG: "",
    photos: [],
    documents: [],
    figures: {
      coreMaterial: "mnzn-ferrite",
      coreAreaM2: "",
      pathLengthM: "",
      gapM: "",
      alNh: "",
      meanTurnLengthM: "",
      ratedCurrentA: "",
      switchingFrequencyHz: "",
      primaryVoltageV: "",
      windings: [emptyWinding()],
    },
    declaration: {
      // A board or kit usually sits on the mains; a magnetic usually does not, but may (a main transformer's primary).
      mainsConnected: kind !== "magnetic",
      mainsVrms: kind !== "magnetic" ? "230" : "",
      mainsTolerance: "10",
      busCapacitanceF: "",
      bleederOhm: "",
      liveHeatsinks: false,
      weldingSource: false,
      openCircuitV: "",
      ocvKind: "dc",
      environment: "normal",
    },
    notes: emptyNotes(),
    checkpoints: [],
    requirements: [],
  };
}

const plain = new Intl.NumberFormat("en", { maximumSignificantDigits: 12, useGrouping: false });

/** SI → the text a field shows, in its own unit; "" for an absent value. */
export function toField(si: number | null | undefined, path: string): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "";
  const spec = specFor(path);
  if (!spec) return plain.format(si);
  return plain.format(spec.toSi < 1 ? si * Math.round(1 / spec.toSi) : si / spec.toSi);
}

function fromField(text: string, path: string): number | undefined {
  const value = readNumber(text);
  if (value === undefined) return undefined;
  const spec = specFor(path);
  // Division keeps µ and m prefixes exact where multiplication by 1e-6 would not (47 × 1e-6 ≠ 4.7e-5).
  return spec && spec.toSi < 1 ? value / Math.round(1 / spec.toSi) : value * (spec?.toSi ?? 1);
}

type ListingLike = {
  kind: ListingKind;
  magneticSubtype: MagneticSubtype | null;
  title: string;
  descriptionMd: string;
  priceMinor: number;
  currency: string;
  stock: number;
  shippingWeightG: number;
  figures: Record<string, unknown>;
  declaration: object;
  safetyNotes: { topic: string; text: string; waitSeconds?: number }[];
};

/** A stored listing back into the form. */
export function valuesFromListing(
  listing: ListingLike,
  rows: {
    photos: PhotoValue[];
    documents: DocumentValue[];
    checkpoints: { stage: BringUpStage; name: string; measure: string; unit: string; expectedMin: number; expectedMax: number }[];
    requirements: { subtype: MagneticSubtype; label: string; minInductanceH: number | null; atCurrentA: number | null }[];
  },
): FormValues {
  const base = defaultValues(listing.kind);
  const f = listing.figures as Record<string, number | string | undefined> & { windings?: Record<string, unknown>[] };
  const d = listing.declaration as Record<string, unknown>;
  const num = (v: unknown) => (typeof v === "number" ? v : undefined);
  const notes = emptyNotes();
  for (const n of listing.safetyNotes) {
    if (n.topic in notes) notes[n.topic as SafetyTopicKey] = { text: n.text, waitSeconds: n.waitSeconds === undefined ? "" : String(n.waitSeconds) };
  }
  return {
    ...base,
    magneticSubtype: listing.magneticSubtype ?? base.magneticSubtype,
    title: listing.title,
    descriptionMd: listing.descriptionMd,
    price: minorToPriceText(listing.priceMinor),
    currency: listing.currency as Currency,
    stock: String(listing.stock),
    shippingWeightG: String(listing.shippingWeightG),
    photos: rows.photos,
    documents: rows.documents,
    figures: {
      coreMaterial: typeof f.coreMaterial === "string" ? f.coreMaterial : base.figures.coreMaterial,
      coreAreaM2: toField(num(f.coreAreaM2), "figures.coreAreaM2"),
      pathLengthM: toField(num(f.pathLengthM), "figures.pathLengthM"),
      gapM: toField(num(f.gapM), "figures.gapM"),
      alNh: toField(num(f.alNh), "figures.alNh"),
      meanTurnLengthM: toField(num(f.meanTurnLengthM), "figures.meanTurnLengthM"),
      ratedCurrentA: toField(num(f.ratedCurrentA), "figures.ratedCurrentA"),
      switchingFrequencyHz: toField(num(f.switchingFrequencyHz), "figures.switchingFrequencyHz"),
      primaryVoltageV: toField(num(f.primaryVoltageV), "figures.primaryVoltageV"),
      windings: f.windings?.length
        ? f.windings.map((w) => ({
            name: String(w.name ?? ""),
            role: (w.role as WindingRole) ?? "winding",
            turns: toField(num(w.turns), "figures.windings.0.turns"),
            material: String(w.material ?? "copper"),
            areaM2: toField(num(w.areaM2), "figures.windings.0.areaM2"),
            strands: toField(num(w.strands), "figures.windings.0.strands"),
            currentA: toField(num(w.currentA), "figures.windings.0.currentA"),
          }))
        : base.figures.windings,
    },
    declaration: {
      mainsConnected: d.mainsConnected === true,
      mainsVrms: toField(num(d.mainsVrms), "declaration.mainsVrms"),
      mainsTolerance: toField(num(d.mainsTolerance) ?? 0.1, "declaration.mainsTolerance"),
      busCapacitanceF: toField(num(d.busCapacitanceF), "declaration.busCapacitanceF"),
      bleederOhm: toField(num(d.bleederOhm), "declaration.bleederOhm"),
      liveHeatsinks: d.liveHeatsinks === true,
      weldingSource: d.weldingSource === true,
      openCircuitV: toField(num(d.openCircuitV), "declaration.openCircuitV"),
      ocvKind: d.ocvKind === "ac" ? "ac" : "dc",
      environment: d.environment === "increased-hazard" ? "increased-hazard" : "normal",
    },
    notes,
    checkpoints: rows.checkpoints.map((c) => ({ ...c, expectedMin: String(c.expectedMin), expectedMax: String(c.expectedMax) })),
    requirements: rows.requirements.map((r) => ({
      subtype: r.subtype,
      label: r.label,
      minInductanceH: toField(r.minInductanceH, "requirements.0.minInductanceH"),
      atCurrentA: toField(r.atCurrentA, "requirements.0.atCurrentA"),
    })),
  };
}

/** Drops absent members so optional figures stay optional. */
function defined<T extends Record<string, unknown>>(object: T): T {
  return Object.fromEntries(Object.entries(object).filter(([, v]) => v !== undefined)) as T;
}

export function declarationInput(values: FormValues) {
  const d = values.declaration;
  return defined({
    mainsConnected: d.mainsConnected,
    mainsVrms: d.mainsConnected ? fromField(d.mainsVrms, "declaration.mainsVrms") : undefined,
    mainsTolerance: d.mainsConnected ? fromField(d.mainsTolerance, "declaration.mainsTolerance") : undefined,
    busCapacitanceF: fromField(d.busCapacitanceF, "declaration.busCapacitanceF"),
    bleederOhm: fromField(d.bleederOhm, "declaration.bleederOhm"),
    liveHeatsinks: d.liveHeatsinks,
    weldingSource: d.weldingSource,
    openCircuitV: d.weldingSource ? fromField(d.openCircuitV, "declaration.openCircuitV") : undefined,
    ocvKind: d.weldingSource ? d.ocvKind : undefined,
    environment: d.weldingSource ? d.environment : undefined,
  });
}

/** The notes a person has written, in topic order; `topics[i]` is the topic of note i. */
export function notesInput(values: FormValues) {
  const topics: SafetyTopicKey[] = [];
  const notes = [];
  for (const topic of SAFETY_TOPIC_KEYS) {
    const note = values.notes[topic];
    if (note.text.trim() === "" && note.waitSeconds.trim() === "") continue;
    topics.push(topic);
    notes.push(defined({ topic, text: note.text, waitSeconds: topic === "stored-charge" ? fromField(note.waitSeconds, "notes.*.waitSeconds") : undefined }));
  }
  return { notes, topics };
}

/** The whole form as the schema's input (what the server action receives). */
export function toInput(values: FormValues): { input: ListingDraftInput; noteTopics: SafetyTopicKey[] } {
  const { notes, topics } = notesInput(values);
  const common = {
    title: values.title,
    descriptionMd: values.descriptionMd,
    price: values.price,
    currency: values.currency,
    stock: fromField(values.stock, "stock"),
    shippingWeightG: fromField(values.shippingWeightG, "shippingWeightG"),
    photos: values.photos.map((p) => ({ key: p.key, alt: p.alt })),
    documents: values.documents.map((d) => ({ key: d.key, kind: d.kind, title: d.title })),
    declaration: declarationInput(values),
    notes,
  };
  const f = values.figures;
  let input: Record<string, unknown>;
  if (values.kind === "magnetic") {
    input = {
      kind: "magnetic",
      magneticSubtype: values.magneticSubtype,
      ...common,
      figures: defined({
        coreMaterial: f.coreMaterial || undefined,
        coreAreaM2: fromField(f.coreAreaM2, "figures.coreAreaM2"),
        pathLengthM: fromField(f.pathLengthM, "figures.pathLengthM"),
        gapM: fromField(f.gapM, "figures.gapM"),
        alNh: fromField(f.alNh, "figures.alNh"),
        meanTurnLengthM: fromField(f.meanTurnLengthM, "figures.meanTurnLengthM"),
        ratedCurrentA: fromField(f.ratedCurrentA, "figures.ratedCurrentA"),
        switchingFrequencyHz: fromField(f.switchingFrequencyHz, "figures.switchingFrequencyHz"),
        primaryVoltageV: values.magneticSubtype === "transformer" ? fromField(f.primaryVoltageV, "figures.primaryVoltageV") : undefined,
        windings: f.windings.map((w, i) => ({
          name: w.name,
          role: w.role,
          material: w.material,
          turns: fromField(w.turns, `figures.windings.${i}.turns`),
          areaM2: fromField(w.areaM2, `figures.windings.${i}.areaM2`),
          strands: fromField(w.strands, `figures.windings.${i}.strands`) ?? 1,
          currentA: fromField(w.currentA, `figures.windings.${i}.currentA`),
        })),
      }),
    };
  } else if (values.kind === "kit") {
    input = {
      kind: "kit",
      ...common,
      checkpoints: values.checkpoints.map((c) => ({ ...c, expectedMin: readNumber(c.expectedMin), expectedMax: readNumber(c.expectedMax) })),
      requirements: values.requirements.map((r, i) =>
        defined({
          subtype: r.subtype,
          label: r.label,
          minInductanceH: fromField(r.minInductanceH, `requirements.${i}.minInductanceH`),
          atCurrentA: fromField(r.atCurrentA, `requirements.${i}.atCurrentA`),
        }),
      ),
    };
  } else {
    input = { kind: "board", ...common };
  }
  return { input: input as ListingDraftInput, noteTopics: topics };
}

export type FormErrors = Record<string, string[]>;

/** Schema paths → form paths: a note's index becomes its topic ("notes.2.text" → "notes.first-power-up.text"). */
export function formPath(path: string, noteTopics: readonly SafetyTopicKey[]): string {
  const note = /^notes\.(\d+)(\..*)?$/.exec(path);
  if (!note) return path;
  const topic = noteTopics[Number(note[1])];
  return topic ? `notes.${topic}${note[2] ?? ""}` : path;
}

/** Every problem the schema finds, in the units of the field it belongs to. */
export function validate(values: FormValues): { ok: true; input: ListingDraftInput } | { ok: false; errors: FormErrors; input: ListingDraftInput } {
  const { input, noteTopics } = toInput(values);
  const parsed = listingDraftSchema.safeParse(input);
  if (parsed.success) return { ok: true, input };
  const errors: FormErrors = {};
  for (const issue of parsed.error.issues) {
    const path = issue.path.map(String).join(".");
    (errors[formPath(path, noteTopics)] ??= []).push(issueMessage(issue, specFor(path)));
  }
  return { ok: false, errors, input };
}
