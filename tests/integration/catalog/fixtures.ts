// Thirty-odd invented listings for the catalog's tests: live ones of every kind, price, stock and
// mains rating, and one listing in each non-live state whose title would match a search for
// "choke", so a broken state filter cannot hide.
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "@/db/schema";
import type { ListingKind, ListingState, MagneticSubtype } from "@/db/schema/listings";
import type { SafetyDeclaration } from "@/lib/policy";

// Sellers of their own rather than the demo seed's, so what the seed holds never changes a count here.
export const SHOPS = {
  coils: { userId: "catalog-seller-coils", name: "Wren Halvorsen-Abara", shopName: "Larkspur Coil Room", slug: "larkspur-coil-room" },
  boards: { userId: "catalog-seller-boards", name: "Tobiah Ferreira-Lund", shopName: "Yard Kitworks", slug: "yard-kitworks" },
} as const;
type ShopKey = keyof typeof SHOPS;

type Requirement = { subtype: MagneticSubtype; label: string; minInductanceH: number | null; atCurrentA: number | null };

export type Fixture = {
  key: string;
  title: string;
  kind: ListingKind;
  subtype?: MagneticSubtype;
  state: ListingState;
  priceMinor: number;
  stock: number;
  mains: boolean;
  shop: ShopKey;
  /** days before the reference instant it went live; null if it never did */
  liveDaysAgo: number | null;
  description?: string;
  figures?: Record<string, unknown>;
  inductanceH?: number;
  ratedCurrentA?: number;
  requirements?: Requirement[];
};

const REFERENCE = Date.parse("2026-10-01T12:00:00Z");
const DAY = 86_400_000;

const named: Fixture[] = [
  { key: "choke-22", title: "Output choke 22 µH, 120 A", kind: "magnetic", subtype: "choke", state: "live", priceMinor: 4800, stock: 3, mains: false, shop: "coils", liveDaysAgo: 3, description: "Powder-core toroid wound with flat copper strip, for the output filter of a welding inverter.", figures: { coreMaterial: "iron-powder" }, inductanceH: 22e-6, ratedCurrentA: 120 },
  { key: "choke-40", title: "Toroidal output choke 40 µH, 60 A", kind: "magnetic", subtype: "choke", state: "live", priceMinor: 3900, stock: 0, mains: false, shop: "coils", liveDaysAgo: 10, figures: { coreMaterial: "iron-powder" }, inductanceH: 40e-6, ratedCurrentA: 60 },
  { key: "main-transformer", title: "Main transformer, 40 kHz half bridge", kind: "magnetic", subtype: "transformer", state: "live", priceMinor: 9500, stock: 1, mains: true, shop: "coils", liveDaysAgo: 5, figures: { coreMaterial: "mnzn-ferrite" }, inductanceH: 2e-3, ratedCurrentA: 80 },
  { key: "sense-ct", title: "Current-sense transformer 1:100", kind: "magnetic", subtype: "current-transformer", state: "live", priceMinor: 1200, stock: 12, mains: false, shop: "coils", liveDaysAgo: 20, figures: { coreMaterial: "nanocrystalline" }, inductanceH: 5e-3, ratedCurrentA: 30 },
  { key: "gate-drive", title: "Half-bridge gate drive board", kind: "board", state: "live", priceMinor: 3500, stock: 10, mains: true, shop: "boards", liveDaysAgo: 1, description: "Pairs with a nanocrystalline current-sense transformer for cycle-by-cycle limiting." },
  { key: "bleeder-board", title: "Bleeder resistor board for bulk capacitors", kind: "board", state: "live", priceMinor: 1500, stock: 7, mains: true, shop: "boards", liveDaysAgo: 2, description: "Mounts across the DC bus, beside the output choke of most builds." },
  // A near miss for the typo path: "chopper" is as close to "choek" by prefix as "choke" is.
  { key: "chopper-board", title: "Chopper board for a buck stage", kind: "board", state: "live", priceMinor: 2700, stock: 5, mains: false, shop: "boards", liveDaysAgo: 9 },
  { key: "stick-kit", title: "Stick welder inverter kit 160 A", kind: "kit", state: "live", priceMinor: 24900, stock: 2, mains: true, shop: "boards", liveDaysAgo: 4, requirements: [{ subtype: "choke", label: "Output choke", minInductanceH: 18e-6, atCurrentA: 110 }] },
  { key: "heater-kit", title: "Induction heater kit 1 kW", kind: "kit", state: "live", priceMinor: 18900, stock: 4, mains: true, shop: "boards", liveDaysAgo: 6, requirements: [{ subtype: "choke", label: "Tank choke", minInductanceH: 30e-6, atCurrentA: 50 }] },
  { key: "bench-kit", title: "Bench supply kit 0–30 V", kind: "kit", state: "live", priceMinor: 12900, stock: 0, mains: true, shop: "boards", liveDaysAgo: 8, requirements: [{ subtype: "transformer", label: "Main transformer", minInductanceH: 1e-3, atCurrentA: 50 }] },
];

const fillers: Fixture[] = Array.from({ length: 16 }, (_, i) => ({
  key: `proto-${i + 1}`,
  title: `Prototype board number ${i + 1}`,
  kind: "board" as const,
  state: "live" as const,
  // Distinct prices, not in the order of the keys, so a sort by price has work to do.
  priceMinor: 1000 + ((i * 7919) % 14) * 350 + i,
  stock: i % 3,
  mains: i % 2 === 0,
  shop: i % 2 === 0 ? ("boards" as const) : ("coils" as const),
  liveDaysAgo: 30 + i,
  description: "A plain prototype board.",
}));

// Every one of these would match "choke", be cheap, in stock and newest if it leaked through.
const hidden: Fixture[] = (
  [
    ["draft-choke", "draft", null],
    ["review-choke", "in_review", null],
    ["sent-back-choke", "sent_back", null],
    ["held-choke", "held", 0],
    ["retired-choke", "retired", 0],
  ] as const
).map(([key, state, liveDaysAgo]) => ({
  key,
  title: `Output choke 30 µH, 150 A (${key})`,
  kind: "magnetic" as const,
  subtype: "choke" as const,
  state,
  priceMinor: 100,
  stock: 50,
  mains: false,
  shop: "coils" as const,
  liveDaysAgo,
  inductanceH: 30e-6,
  ratedCurrentA: 150,
}));

const hiddenKits: Fixture[] = (
  [
    ["held-kit", "held"],
    ["draft-kit", "draft"],
  ] as const
).map(([key, state]) => ({
  key,
  title: `Welder kit needing a choke (${key})`,
  kind: "kit" as const,
  state,
  priceMinor: 150,
  stock: 5,
  mains: true,
  shop: "boards" as const,
  liveDaysAgo: state === "held" ? 0 : null,
  requirements: [{ subtype: "choke" as const, label: "Any output choke", minInductanceH: 1e-6, atCurrentA: 1 }],
}));

export const FIXTURES: Fixture[] = [...named, ...fillers, ...hidden, ...hiddenKits];
export const LIVE = FIXTURES.filter((f) => f.state === "live");

function declaration(mains: boolean): SafetyDeclaration {
  return mains
    ? { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 940e-6, bleederOhm: 47_000, liveHeatsinks: false, weldingSource: false }
    : { mainsConnected: false, liveHeatsinks: false, weldingSource: false };
}

/** Inserts the shops, FIXTURES and `extra` (each with photos); returns the listing id of each key. */
export async function insertCatalogFixtures(url: string, extra: Fixture[] = []): Promise<Record<string, string>> {
  const pool = new pg.Pool({ connectionString: url, max: 2 });
  const db = drizzle(pool, { schema });
  try {
    await db.insert(schema.users).values(Object.values(SHOPS).map((s) => ({ id: s.userId, email: `${s.userId}@catalog.test`, name: s.name })));
    await db.insert(schema.sellerProfiles).values(
      Object.values(SHOPS).map((s) => ({
        userId: s.userId,
        shopName: s.shopName,
        slug: s.slug,
        profileMd: "An invented shop for the catalog tests.",
        country: "NL",
        returnsPolicyMd: "Unused parts within 30 days.",
        payoutAccountId: `acct_catalog_${s.slug}`,
        payoutsEnabled: true,
        chargesEnabled: true,
      })),
    );
    const ids: Record<string, string> = {};
    for (const f of [...FIXTURES, ...extra]) {
      const live = f.liveDaysAgo === null ? null : new Date(REFERENCE - f.liveDaysAgo * DAY);
      const [row] = await db
        .insert(schema.listings)
        .values({
          sellerId: SHOPS[f.shop].userId,
          kind: f.kind,
          magneticSubtype: f.subtype ?? null,
          title: f.title,
          slug: f.key,
          descriptionMd: f.description ?? "",
          priceMinor: f.priceMinor,
          currency: "EUR",
          stock: f.stock,
          figures: f.figures ?? {},
          declaration: declaration(f.mains),
          state: f.state,
          inductanceH: f.inductanceH ?? null,
          ratedCurrentA: f.ratedCurrentA ?? null,
          liveAt: live,
        })
        .returning({ id: schema.listings.id });
      if (!row) throw new Error(`no id for ${f.key}`);
      ids[f.key] = row.id;
      // Two photos: the cover is the one at position 0, whichever was stored first.
      for (const position of [1, 0]) {
        const key = `${f.key}-photo-${position}`;
        await db.insert(schema.uploads).values({
          key,
          ownerId: SHOPS[f.shop].userId,
          purpose: "listing-photo",
          originalName: `${key}.webp`,
          contentType: "image/webp",
          bytes: 1000,
          url: `/demo/${key}.webp`,
          thumbUrl: `/demo/${key}-thumb.webp`,
        });
        await db.insert(schema.listingPhotos).values({ listingId: row.id, uploadKey: key, position, alt: `${f.title}, photo ${position + 1}` });
      }
      if (f.requirements?.length) {
        await db.insert(schema.listingRequirements).values(f.requirements.map((r) => ({ listingId: row.id, ...r })));
      }
    }
    return ids;
  } finally {
    await pool.end();
  }
}
