// Which kits a magnetic fits, and which magnetics fit a kit: SQL over listings' inductance,
// rated current and subtype against kits' listing_requirements, live listings only. The
// expected answers are the worked example of the brief (a 22 µH / 120 A choke fits "≥ 18 µH at
// 110 A", not "≥ 30 µH") and, for a grid of edge cases, the pure rule in lib/listings/fit.ts.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fitsRequirement, type KitRequirement } from "@/lib/listings/fit";
import { freshDatabase } from "../../support/test-database";
import { FIXTURES, insertCatalogFixtures, type Fixture } from "./fixtures";

const grid: Fixture[] = [
  // 3 × 6 µH is 1.8000000000000002e-5 in binary floating point: a hair above 18 µH.
  { key: "g-exact", inductanceH: 3 * 6e-6, ratedCurrentA: 110 },
  // a hair below both figures, as a value typed in µH and stored in H can land
  { key: "g-hair-below", inductanceH: 18e-6 * (1 - 1e-12), ratedCurrentA: 110 * (1 - 1e-12) },
  { key: "g-below", inductanceH: 17.9e-6, ratedCurrentA: 200 },
  { key: "g-current-low", inductanceH: 50e-6, ratedCurrentA: 109 },
  { key: "g-no-figures" },
].map((g, i) => ({
  title: `Grid choke ${g.key}`,
  kind: "magnetic" as const,
  subtype: "choke" as const,
  state: "live" as const,
  priceMinor: 2000 + i,
  stock: 1,
  mains: false,
  shop: "coils" as const,
  liveDaysAgo: 50,
  ...g,
}));

const gridCt: Fixture = { key: "g-ct", title: "Grid current transformer", kind: "magnetic", subtype: "current-transformer", state: "live", priceMinor: 900, stock: 1, mains: false, shop: "coils", liveDaysAgo: 50, inductanceH: 1e-3, ratedCurrentA: 200 };

const gridKit: Fixture = {
  key: "g-kit",
  title: "Grid kit",
  kind: "kit",
  state: "live",
  priceMinor: 10_000,
  stock: 1,
  mains: true,
  shop: "boards",
  liveDaysAgo: 50,
  requirements: [
    { subtype: "choke", label: "Choke at 110 A", minInductanceH: 18e-6, atCurrentA: 110 },
    { subtype: "choke", label: "Any choke", minInductanceH: null, atCurrentA: null },
    { subtype: "choke", label: "Choke of 20 µH, any current", minInductanceH: 20e-6, atCurrentA: null },
    { subtype: "current-transformer", label: "Sense transformer", minInductanceH: null, atCurrentA: 100 },
  ],
};

const EXTRA = [...grid, gridCt, gridKit];
const ALL = [...FIXTURES, ...EXTRA];
const LIVE_MAGNETICS = ALL.filter((f) => f.state === "live" && f.kind === "magnetic");
const LIVE_KITS = ALL.filter((f) => f.state === "live" && f.kind === "kit");

const offer = (f: Fixture) => ({ subtype: f.subtype!, inductanceH: f.inductanceH ?? null, ratedCurrentA: f.ratedCurrentA ?? null });

let database: Awaited<ReturnType<typeof freshDatabase>>;
let ids: Record<string, string>;
let catalog: typeof import("@/db/queries/catalog");

beforeAll(async () => {
  database = await freshDatabase("catalog_fit");
  ids = await insertCatalogFixtures(database.url, EXTRA);
  process.env.DATABASE_URL = database.url;
  catalog = await import("@/db/queries/catalog");
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await database.drop();
});

const id = (key: string) => {
  const value = ids[key];
  if (!value) throw new Error(`no fixture ${key}`);
  return value;
};

describe("kitsFittedByMagnetic", () => {
  it("a 22 µH choke rated 120 A fits the kit needing ≥ 18 µH at 110 A, not the one needing ≥ 30 µH", async () => {
    const kits = await catalog.kitsFittedByMagnetic(id("choke-22"));
    const slugs = kits.map((k) => k.slug);
    expect(slugs).toContain("stick-kit");
    expect(slugs).not.toContain("heater-kit");
    expect(kits.find((k) => k.slug === "stick-kit")).toMatchObject({ title: "Stick welder inverter kit 160 A", priceMinor: 24900, currency: "EUR", requirementLabel: "Output choke" });
  });

  it("never names a kit that is not live, though the held and draft kits' requirement (≥ 1 µH at 1 A) is met", async () => {
    const slugs = (await catalog.kitsFittedByMagnetic(id("choke-22"))).map((k) => k.slug);
    expect(slugs).not.toContain("held-kit");
    expect(slugs).not.toContain("draft-kit");
  });

  it("a 40 µH choke rated only 60 A fits the 30 µH / 50 A kit but not the 110 A one", async () => {
    const slugs = (await catalog.kitsFittedByMagnetic(id("choke-40"))).map((k) => k.slug);
    expect(slugs).toContain("heater-kit");
    expect(slugs).not.toContain("stick-kit");
  });

  it("a transformer fits a transformer requirement and no choke requirement", async () => {
    expect((await catalog.kitsFittedByMagnetic(id("main-transformer"))).map((k) => k.slug)).toEqual(["bench-kit"]);
  });

  it("names at most the limit asked for, in title order, so a part that fits thousands of kits keeps its page small", async () => {
    const all = await catalog.kitsFittedByMagnetic(id("choke-22"));
    expect(all.length).toBeGreaterThan(1);
    expect(await catalog.kitsFittedByMagnetic(id("choke-22"), 1)).toEqual(all.slice(0, 1));
  });

  it("a board fits nothing", async () => {
    expect(await catalog.kitsFittedByMagnetic(id("gate-drive"))).toEqual([]);
  });

  it("names a kit once even when several of its requirements are met, with the first by label", async () => {
    const kits = (await catalog.kitsFittedByMagnetic(id("g-exact"))).filter((k) => k.slug === "g-kit");
    // g-exact meets "Choke at 110 A" and "Any choke" (not "Choke of 20 µH").
    expect(kits).toEqual([expect.objectContaining({ requirementLabel: "Any choke" })]);
  });

  it.each(LIVE_MAGNETICS.map((m) => [m.key, m] as const))("%s: the same kits as lib/listings/fit.ts", async (_key, magnetic) => {
    const expected = LIVE_KITS.filter((kit) => (kit.requirements ?? []).some((r) => fitsRequirement(offer(magnetic), r).fits)).map((k) => k.key);
    const got = (await catalog.kitsFittedByMagnetic(id(magnetic.key))).map((k) => k.slug);
    expect([...got].sort()).toEqual([...expected].sort());
  });
});

describe("magneticsFittingKit", () => {
  it("the kit needing ≥ 18 µH at 110 A is fitted by the live 22 µH / 120 A choke, not by live-looking drafts or held chokes", async () => {
    const [requirement, ...others] = await catalog.magneticsFittingKit(id("stick-kit"));
    expect(others).toEqual([]);
    expect(requirement).toMatchObject({ label: "Output choke", subtype: "choke", minInductanceH: 18e-6, atCurrentA: 110 });
    const slugs = requirement!.magnetics.map((m) => m.slug);
    expect(slugs).toContain("choke-22");
    expect(slugs).not.toContain("choke-40");
    for (const hidden of ["draft-choke", "review-choke", "sent-back-choke", "held-choke", "retired-choke"]) expect(slugs).not.toContain(hidden);
    expect(requirement!.magnetics.find((m) => m.slug === "choke-22")).toMatchObject({ inductanceH: 22e-6, ratedCurrentA: 120, shopName: "Larkspur Coil Room" });
  });

  it("a kit with no requirements has nothing to fit", async () => {
    expect(await catalog.magneticsFittingKit(id("gate-drive"))).toEqual([]);
  });

  it("each requirement of the grid kit gets exactly the live magnetics lib/listings/fit.ts accepts, cheapest first", async () => {
    const result = await catalog.magneticsFittingKit(id("g-kit"));
    expect(result.map((r) => r.label)).toEqual([...gridKit.requirements!.map((r) => r.label)].sort());
    for (const r of result) {
      const requirement: KitRequirement = { subtype: r.subtype, label: r.label, minInductanceH: r.minInductanceH, atCurrentA: r.atCurrentA };
      const expected = LIVE_MAGNETICS.filter((m) => fitsRequirement(offer(m), requirement).fits)
        .sort((a, b) => a.priceMinor - b.priceMinor)
        .map((m) => m.key);
      expect(r.magnetics.map((m) => m.slug), r.label).toEqual(expected);
    }
    // The edges, spelled out: the float hair above and below passes, a tenth of a µH short does not.
    const at110 = result.find((r) => r.label === "Choke at 110 A")!.magnetics.map((m) => m.slug);
    expect(at110).toEqual(expect.arrayContaining(["g-exact", "g-hair-below", "choke-22"]));
    expect(at110).not.toContain("g-below");
    expect(at110).not.toContain("g-current-low");
    expect(at110).not.toContain("g-no-figures");
    expect(result.find((r) => r.label === "Any choke")!.magnetics.map((m) => m.slug)).toContain("g-no-figures");
    expect(result.find((r) => r.label === "Sense transformer")!.magnetics.map((m) => m.slug)).toEqual(["g-ct"]);
  });
});
