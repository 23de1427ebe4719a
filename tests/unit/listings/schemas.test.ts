// The shared listing schemas: the bounds the issue sets (title 5–120, description ≤ 20 000,
// stock 0–10 000, 1–8 photos on submit, 0 while drafting) and the kind-specific shapes.
import { describe, expect, it } from "vitest";
import { listingDraftSchema, listingSubmitSchema, magneticFiguresSchema, stockUpdateSchema } from "@/lib/validations/listings";

const declaration = { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 680e-6, bleederOhm: 100e3, liveHeatsinks: true, weldingSource: false };
const photo = (n: number) => ({ key: `photo-${n}`, alt: "" });

const kit = {
  kind: "kit",
  title: "Half-bridge stick welder kit",
  descriptionMd: "Board, magnetics list and build notes.",
  price: "189.00",
  currency: "EUR",
  stock: 4,
  shippingWeightG: 1800,
  photos: [photo(1)],
  declaration,
  notes: [],
  checkpoints: [{ stage: "series-lamp", name: "Bus through lamp", measure: "DC bus across C1", unit: "V", expectedMin: 300, expectedMax: 340 }],
  requirements: [{ subtype: "choke", label: "Output choke", minInductanceH: 40e-6, atCurrentA: 120 }],
};

const choke = {
  kind: "magnetic",
  magneticSubtype: "choke",
  title: "Output choke 60 µH / 10 A",
  price: "48.50",
  currency: "EUR",
  stock: 2,
  shippingWeightG: 400,
  photos: [photo(1)],
  declaration: { mainsConnected: false, liveHeatsinks: false, weldingSource: false },
  figures: {
    coreMaterial: "mnzn-ferrite",
    coreAreaM2: 125e-6,
    pathLengthM: 0.107,
    gapM: 1e-3,
    windings: [{ name: "main", role: "winding", turns: 20, material: "copper", areaM2: 4e-6, strands: 20, currentA: 10 }],
    ratedCurrentA: 10,
    switchingFrequencyHz: 100e3,
  },
};

function errorPaths(result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }): string[] {
  return (result.error?.issues ?? []).map((i) => i.path.map(String).join("."));
}

describe("listing basics", () => {
  it("accepts a complete kit and keeps its checkpoints and requirements", () => {
    const parsed = listingSubmitSchema.parse(kit);
    expect(parsed.kind).toBe("kit");
    if (parsed.kind !== "kit") throw new Error("kind");
    expect(parsed.price).toBe(18900);
    expect(parsed.checkpoints[0]?.stage).toBe("series-lamp");
    expect(parsed.requirements[0]?.minInductanceH).toBe(40e-6);
  });

  it("bounds the title to 5–120 characters after trimming", () => {
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, title: "  PCB  " }))).toContain("title");
    expect(listingDraftSchema.safeParse({ ...kit, title: "Board" }).success).toBe(true);
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, title: "x".repeat(121) }))).toContain("title");
  });

  it("bounds the description to 20 000 characters", () => {
    expect(listingDraftSchema.safeParse({ ...kit, descriptionMd: "x".repeat(20_000) }).success).toBe(true);
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, descriptionMd: "x".repeat(20_001) }))).toContain("descriptionMd");
  });

  it("keeps stock within 0–10 000 whole units", () => {
    for (const stock of [-1, 10_001, 2.5]) expect(stockUpdateSchema.safeParse({ stock }).success, String(stock)).toBe(false);
    for (const stock of [0, 10_000]) expect(stockUpdateSchema.safeParse({ stock }).success).toBe(true);
  });

  it("lets a draft have no photos but a submission needs 1 to 8", () => {
    expect(listingDraftSchema.safeParse({ ...kit, photos: [] }).success).toBe(true);
    expect(errorPaths(listingSubmitSchema.safeParse({ ...kit, photos: [] }))).toContain("photos");
    expect(listingSubmitSchema.safeParse({ ...kit, photos: Array.from({ length: 8 }, (_, i) => photo(i)) }).success).toBe(true);
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, photos: Array.from({ length: 9 }, (_, i) => photo(i)) }))).toContain("photos");
  });

  it("refuses an unknown kind and an unknown currency", () => {
    expect(listingDraftSchema.safeParse({ ...kit, kind: "gadget" }).success).toBe(false);
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, currency: "JPY" }))).toContain("currency");
  });

  it("checks the safety declaration with the policy's own schema (a mains item needs its voltage)", () => {
    const { mainsVrms: _dropped, ...noVoltage } = declaration;
    expect(errorPaths(listingDraftSchema.safeParse({ ...kit, declaration: noVoltage }))).toContain("declaration.mainsVrms");
  });
});

describe("kit rows", () => {
  it("refuses a checkpoint whose highest expected reading is below the lowest", () => {
    const bad = { ...kit, checkpoints: [{ ...kit.checkpoints[0], expectedMin: 340, expectedMax: 300 }] };
    expect(errorPaths(listingDraftSchema.safeParse(bad))).toContain("checkpoints.0.expectedMax");
  });

  it("refuses an unknown bring-up stage", () => {
    const bad = { ...kit, checkpoints: [{ ...kit.checkpoints[0], stage: "smoke-test" }] };
    expect(errorPaths(listingDraftSchema.safeParse(bad))).toContain("checkpoints.0.stage");
  });

  it("needs a requirement to state an inductance or a current", () => {
    const bad = { ...kit, requirements: [{ subtype: "choke", label: "Output choke" }] };
    expect(errorPaths(listingDraftSchema.safeParse(bad))).toContain("requirements.0.minInductanceH");
  });
});

describe("magnetic figures", () => {
  it("accepts a complete choke", () => {
    expect(listingSubmitSchema.safeParse(choke).success).toBe(true);
  });

  it("lets a draft leave figures out, but not a submission", () => {
    const partial = { ...choke, figures: { coreMaterial: "mnzn-ferrite" } };
    expect(listingDraftSchema.safeParse(partial).success).toBe(true);
    expect(errorPaths(listingSubmitSchema.safeParse(partial))).toEqual(expect.arrayContaining(["figures.coreAreaM2", "figures.windings"]));
  });

  it("refuses a core material that is not in lib/engineering", () => {
    expect(errorPaths(magneticFiguresSchema.safeParse({ ...choke.figures, coreMaterial: "unobtainium" }))).toContain("coreMaterial");
  });

  it("needs a transformer to have one primary and a secondary", () => {
    const transformer = { ...choke, magneticSubtype: "transformer" };
    expect(errorPaths(listingSubmitSchema.safeParse(transformer))).toContain("figures.windings");
    const wound = {
      ...transformer,
      figures: {
        ...choke.figures,
        windings: [
          { name: "primary", role: "primary", turns: 28, material: "copper", areaM2: 2e-6, strands: 10, currentA: 6 },
          { name: "secondary", role: "secondary", turns: 5, material: "copper", areaM2: 12e-6, strands: 60, currentA: 30 },
        ],
      },
    };
    expect(listingSubmitSchema.safeParse(wound).success).toBe(true);
  });

  it("refuses a subtype outside the three the product knows", () => {
    expect(errorPaths(listingDraftSchema.safeParse({ ...choke, magneticSubtype: "inductor" }))).toContain("magneticSubtype");
  });
});
