/**
 * Shared schemas of the listing form, used by the client form (live, on every change) and by the
 * server actions (again, before anything is written). Figures are SI throughout; the form types
 * practical units (µH, mm², kHz) and converts before it validates.
 *
 * A draft may be saved with no photos and, for a magnetic, with figures still missing; submitting
 * for review needs 1–8 photos, complete figures and a clear safety sheet (checked on the server by
 * transitionListing with the policy revision in force).
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { CONDUCTOR_MATERIAL_IDS, CORE_MATERIAL_IDS } from "@/lib/engineering/materials";
import { BRING_UP_STAGES, DOCUMENT_KINDS, LISTING_KINDS, MAGNETIC_SUBTYPES } from "@/db/schema/listings";
import { safetyDeclarationSchema, safetyNotesSchema } from "./policy";
import { quantity } from "./calc";

export { BRING_UP_STAGES, DOCUMENT_KINDS, LISTING_KINDS, MAGNETIC_SUBTYPES };

export const CURRENCIES = ["EUR", "GBP", "USD", "CHF", "SEK", "PLN"] as const;
export type Currency = (typeof CURRENCIES)[number];

export const MAX_PHOTOS = 8;
export const MAX_DOCUMENTS = 8;
export const MAX_STOCK = 10_000;
// Every currency above has two minor digits (ISO 4217); a currency without them would need its own rule here.
const MINOR_DIGITS = 2;
// 9 999 999.99 keeps the minor units well inside a PostgreSQL integer.
const MAX_MAJOR_DIGITS = 7;

export const PRICE_FORMAT_MESSAGE = "Enter the price as a number with a point before the cents, e.g. 48.50.";

/**
 * "12.50" → 1250, "12.5" → 1250, "12" → 1200, "0.10" → 10. Exact: the digits are joined as text,
 * never multiplied as a float (0.1 × 100 is 10.000000000000002). A comma is refused rather than
 * guessed at: "1,50" is one and a half in much of Europe and 150 in the UK.
 */
export function parsePriceToMinor(text: string): number | null {
  const match = new RegExp(`^(\\d{1,${MAX_MAJOR_DIGITS}})(?:\\.(\\d{1,${MINOR_DIGITS}}))?$`).exec(text.trim());
  if (!match) return null;
  const whole = match[1] ?? "0";
  const fraction = (match[2] ?? "").padEnd(MINOR_DIGITS, "0");
  return Number.parseInt(`${whole}${fraction}`, 10);
}

/** The other way, for filling the form from a stored listing: 1250 → "12.50". */
export function minorToPriceText(minor: number): string {
  const padded = String(minor).padStart(MINOR_DIGITS + 1, "0");
  return `${padded.slice(0, -MINOR_DIGITS)}.${padded.slice(-MINOR_DIGITS)}`;
}

export const priceTextSchema = z
  .string({ error: PRICE_FORMAT_MESSAGE })
  .regex(NUL_FREE, NUL_ERROR)
  .transform((text, ctx) => {
    const minor = parsePriceToMinor(text);
    if (minor === null) {
      ctx.addIssue({ code: "custom", message: text.includes(",") ? `${PRICE_FORMAT_MESSAGE} Use a point, not a comma.` : PRICE_FORMAT_MESSAGE });
      return z.NEVER;
    }
    if (minor === 0) {
      ctx.addIssue({ code: "custom", message: "A listing needs a price above zero." });
      return z.NEVER;
    }
    return minor;
  });

const whole = (label: string, min: number, max: number) =>
  z.number({ error: `${label} must be a whole number.` }).int({ error: `${label} must be a whole number.` })
    .gte(min, { error: `${label} must be at least ${min}.` })
    .lte(max, { error: `${label} must be at most ${max}.` });

export const stockSchema = whole("Stock", 0, MAX_STOCK);

const uploadKey = z.string({ error: "An upload is missing its key." }).regex(NUL_FREE, NUL_ERROR).min(1).max(200);

export const photoRefSchema = z.object({
  key: uploadKey,
  alt: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(300, { error: "Keep a photo description under 300 characters." }).default(""),
});
export type PhotoRef = z.output<typeof photoRefSchema>;

export const documentRefSchema = z.object({
  key: uploadKey,
  kind: z.enum(DOCUMENT_KINDS, { error: "Choose what the document is: schematic, BOM, build notes or other." }),
  title: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(1, { error: "Give the document a title." }).max(120, { error: "Keep a document title under 120 characters." }),
});
export type DocumentRef = z.output<typeof documentRefSchema>;

// ——— Magnetics ———

export const WINDING_ROLES = ["primary", "secondary", "winding"] as const;
export type WindingRole = (typeof WINDING_ROLES)[number];

export const windingSchema = z.object({
  name: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(1, { error: "Name the winding, e.g. “main” or “secondary 1”." }).max(60),
  role: z.enum(WINDING_ROLES, { error: "Say whether the winding is a primary, a secondary or the only winding." }),
  turns: whole("Turns", 1, 10_000),
  material: z.enum(CONDUCTOR_MATERIAL_IDS, { error: "Choose copper or aluminium." }),
  /** total conductor cross-section of the winding, all strands together, m² */
  areaM2: quantity("Conductor cross-section", { min: 1e-10, max: 1e-2 }),
  strands: whole("Strands", 1, 10_000).default(1),
  /** the RMS current the winding carries at the rated operating point, A */
  currentA: quantity("Winding current", { min: 0, max: 1e4 }),
});
export type Winding = z.output<typeof windingSchema>;

export const magneticFiguresSchema = z.object({
  coreMaterial: z.enum(CORE_MATERIAL_IDS, { error: "Choose the core material." }),
  /** effective core cross-section Ae, m² */
  coreAreaM2: quantity("Core area Ae", { min: 1e-8, max: 0.1 }),
  /** effective magnetic path length le, m */
  pathLengthM: quantity("Path length le", { min: 1e-4, max: 10 }),
  /** total air gap lg, m; 0 for an ungapped core */
  gapM: quantity("Air gap lg", { min: 0, max: 0.1 }),
  /** inductance factor, nH/turn², when the core's datasheet gives one */
  alNh: quantity("AL", { min: 0.1, max: 1e6 }).optional(),
  /** mean length of one turn, m; needed for winding resistance */
  meanTurnLengthM: quantity("Mean turn length", { min: 1e-3, max: 10 }).optional(),
  windings: z.array(windingSchema).min(1, { error: "Add at least one winding." }).max(8, { error: "At most 8 windings." }),
  /** choke: the peak current it is rated for; transformer: the secondary's; current transformer: the primary's */
  ratedCurrentA: quantity("Rated current", { min: 1e-6, max: 1e4 }),
  switchingFrequencyHz: quantity("Switching frequency", { min: 1, max: 1e8 }),
  /** transformers: the square-wave amplitude across the primary, V (half the bus for a half bridge) */
  primaryVoltageV: quantity("Primary voltage", { min: 1e-3, max: 1e5 }).optional(),
});
export type MagneticFigures = z.output<typeof magneticFiguresSchema>;

/** A draft may leave figures out; what is there must still be valid. */
export const magneticFiguresDraftSchema = magneticFiguresSchema.partial().extend({
  windings: z.array(windingSchema).max(8, { error: "At most 8 windings." }).default([]),
});

/** A transformer has one primary and at least one secondary; other magnetics take windings as they come. */
function checkTransformerWindings(listing: { magneticSubtype: string; figures: { windings?: Winding[] } }, ctx: z.RefinementCtx) {
  const windings = listing.figures.windings ?? [];
  if (listing.magneticSubtype !== "transformer" || windings.length === 0) return;
  const path = ["figures", "windings"];
  if (windings.filter((w) => w.role === "primary").length !== 1) {
    ctx.addIssue({ code: "custom", path, message: "A transformer has exactly one primary winding." });
  }
  if (!windings.some((w) => w.role === "secondary")) {
    ctx.addIssue({ code: "custom", path, message: "A transformer needs at least one secondary winding." });
  }
}

// ——— Kits ———

export const checkpointSchema = z
  .object({
    stage: z.enum(BRING_UP_STAGES, { error: "Choose the bring-up stage." }),
    name: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(2, { error: "Name the checkpoint." }).max(120),
    measure: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(2, { error: "Say what to measure and where." }).max(300),
    unit: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(1, { error: "Give the unit, e.g. V or A." }).max(12),
    expectedMin: z.number({ error: "The lowest expected reading must be a number." }),
    expectedMax: z.number({ error: "The highest expected reading must be a number." }),
  })
  .refine((c) => c.expectedMin <= c.expectedMax, { path: ["expectedMax"], error: "The highest expected reading must not be below the lowest." });
export type CheckpointInput = z.output<typeof checkpointSchema>;

export const requirementSchema = z
  .object({
    subtype: z.enum(MAGNETIC_SUBTYPES, { error: "Choose the kind of magnetic the kit needs." }),
    label: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(2, { error: "Describe the part, e.g. “output choke”." }).max(120),
    minInductanceH: quantity("Minimum inductance", { min: 1e-9, max: 100 }).optional(),
    atCurrentA: quantity("Current", { min: 1e-6, max: 1e4 }).optional(),
  })
  .refine((r) => r.minInductanceH !== undefined || r.atCurrentA !== undefined, {
    path: ["minInductanceH"],
    error: "Give a minimum inductance, a current, or both.",
  });
export type RequirementInput = z.output<typeof requirementSchema>;

// ——— The whole form ———

const basics = {
  title: z.string({ error: "Give the listing a title." }).regex(NUL_FREE, NUL_ERROR).trim().min(5, { error: "A title needs at least 5 characters." }).max(120, { error: "Keep the title under 120 characters." }),
  descriptionMd: z.string().regex(NUL_FREE, NUL_ERROR).max(20_000, { error: "Keep the description under 20 000 characters." }).default(""),
  price: priceTextSchema,
  currency: z.enum(CURRENCIES, { error: `Choose one of ${CURRENCIES.join(", ")}.` }),
  stock: stockSchema,
  shippingWeightG: whole("Shipping weight", 0, 100_000),
  photos: z.array(photoRefSchema).max(MAX_PHOTOS, { error: `At most ${MAX_PHOTOS} photos.` }).default([]),
  documents: z.array(documentRefSchema).max(MAX_DOCUMENTS, { error: `At most ${MAX_DOCUMENTS} documents.` }).default([]),
  declaration: safetyDeclarationSchema,
  notes: safetyNotesSchema.default([]),
};

const boardSchema = z.object({ kind: z.literal("board"), ...basics });
const kitSchema = z.object({
  kind: z.literal("kit"),
  ...basics,
  checkpoints: z.array(checkpointSchema).max(40, { error: "At most 40 checkpoints." }).default([]),
  requirements: z.array(requirementSchema).max(12, { error: "At most 12 requirements." }).default([]),
});
const magneticBase = z.object({
  kind: z.literal("magnetic"),
  magneticSubtype: z.enum(MAGNETIC_SUBTYPES, { error: "Choose transformer, choke or current transformer." }),
  ...basics,
});

const withPhotos = {
  photos: z.array(photoRefSchema).min(1, { error: "Add at least one photo; the first is the cover." }).max(MAX_PHOTOS, { error: `At most ${MAX_PHOTOS} photos.` }),
};

/** What a draft save accepts. */
export const listingDraftSchema = z.discriminatedUnion(
  "kind",
  [boardSchema, kitSchema, magneticBase.extend({ figures: magneticFiguresDraftSchema }).superRefine(checkTransformerWindings)],
  { error: "Choose the kind of listing: board, magnetic or kit." },
);
export type ListingDraftInput = z.input<typeof listingDraftSchema>;
export type ListingDraft = z.output<typeof listingDraftSchema>;

/** What submitting for review needs on top of a draft (the safety sheet is checked separately). */
export const listingSubmitSchema = z.discriminatedUnion("kind", [
  boardSchema.extend(withPhotos),
  kitSchema.extend(withPhotos),
  magneticBase.extend({ ...withPhotos, figures: magneticFiguresSchema }).superRefine(checkTransformerWindings),
]);
export type ListingSubmit = z.output<typeof listingSubmitSchema>;

export const stockUpdateSchema = z.object({ stock: stockSchema });

export const LISTING_SORTS = ["title", "state", "price", "stock", "updated"] as const;
export type ListingSort = (typeof LISTING_SORTS)[number];
export const listingSortSchema = z.object({
  sort: z.enum(LISTING_SORTS).catch("updated"),
  dir: z.enum(["asc", "desc"]).catch("desc"),
});
