// Listings whose history the demo tells in full: one held by the platform when a policy grace period
// ran out, one held and restored by a moderator that now has a grace period running, and one its
// seller retired. Invented parts of the Larkspur Yard cooperative; figures SI.
import type { SafetyDeclaration, SafetyNote } from "@/lib/policy";
import type { ListingDecisionKind, ListingState, TopicReason } from "./schema";
import { codesNote } from "./seed-listings";
import type { DemoClock } from "./seed-support";

export type DemoStoryStep = {
  decision: ListingDecisionKind;
  /** null: the platform itself (grace notices and their expiry) */
  actorId: string | null;
  at: Date;
  policyRevision: number;
  note?: string;
  reasons?: TopicReason[];
};

export type DemoStoryListing = {
  id: string;
  sellerId: string;
  kind: "board";
  title: string;
  slug: string;
  descriptionMd: string;
  priceMinor: number;
  stock: number;
  shippingWeightG: number;
  photo: string;
  declaration: SafetyDeclaration;
  notes: SafetyNote[];
  state: ListingState;
  /** the decisions in order; the listing's own columns follow from them */
  story: (clock: DemoClock) => DemoStoryStep[];
};

const KIT_SELLER = "demo-seller-kits";
const MODERATOR = "demo-moderator";

/** Part of a welding power source, downstream of the main transformer: no mains, no bus of its own. */
const weldingOutputStage: SafetyDeclaration = {
  mainsConnected: false,
  liveHeatsinks: false,
  weldingSource: true,
  openCircuitV: 62,
  ocvKind: "dc",
  environment: "normal",
};

export const HELD_AFTER_GRACE_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000009";
export const GRACE_RUNNING_ID = "0b7d1c3e-5a21-4c6e-9f10-00000000000a";
export const RETIRED_ID = "0b7d1c3e-5a21-4c6e-9f10-00000000000b";

export const DEMO_STORY_LISTINGS: DemoStoryListing[] = [
  {
    id: HELD_AFTER_GRACE_ID,
    sellerId: KIT_SELLER,
    kind: "board",
    title: "Secondary rectifier and snubber board, 160 A",
    slug: "secondary-rectifier-snubber-board-160a",
    descriptionMd:
      "The output side of a 160 A stick welder: four fast-recovery dual diodes on a shared heatsink, an RC snubber across each pair and the output terminals.\n\nIt sits behind the main transformer, so it never touches mains.",
    priceMinor: 3900,
    stock: 5,
    shippingWeightG: 700,
    photo: "board-bench-supply",
    declaration: weldingOutputStage,
    notes: [
      // 17 words: enough for revision 1's 12, short of the 20 that revision 2 asks for on this topic.
      { topic: "output-voltage", text: "The output is 62 V DC open circuit, below the 113 V peak limit for normal environments." },
      {
        topic: "arc-hazards",
        text: "Weld only with a helmet of the right shade, leather gloves and flame-resistant clothing, with fume extraction running and a fire watch kept for half an hour after the last weld.",
      },
      codesNote,
    ],
    state: "held",
    story: ({ ago }) => [
      { decision: "submitted", actorId: KIT_SELLER, at: ago(82), policyRevision: 1 },
      { decision: "approved", actorId: MODERATOR, at: ago(81), policyRevision: 1 },
      { decision: "grace_notice", actorId: null, at: ago(60), policyRevision: 2 },
      { decision: "grace_expired", actorId: null, at: ago(46), policyRevision: 2 },
    ],
  },
  {
    id: GRACE_RUNNING_ID,
    sellerId: KIT_SELLER,
    kind: "board",
    title: "Hot-start and arc-force control board",
    slug: "hot-start-arc-force-control-board",
    descriptionMd:
      "A small board for the control side of a stick welder: a hot-start pulse when the arc strikes and arc force that lifts the current when the arc gets short.\n\nPlugs into the gate-drive board's current reference; trimmers for both.",
    priceMinor: 2900,
    stock: 7,
    shippingWeightG: 120,
    photo: "board-gate-drive",
    declaration: weldingOutputStage,
    notes: [
      {
        topic: "output-voltage",
        text: "The open-circuit output stays at 62 V DC, well under the 113 V peak limit of the arc-welding standard for normal environments; this board only shapes the current and never raises that voltage.",
      },
      // 13 words: fine until revision 3 asked for 20 on this topic.
      { topic: "arc-hazards", text: "Wear a welding helmet, gloves and flame-resistant clothing, and weld with good ventilation." },
      codesNote,
    ],
    state: "live",
    story: ({ ago }) => [
      { decision: "submitted", actorId: KIT_SELLER, at: ago(76), policyRevision: 1 },
      { decision: "approved", actorId: MODERATOR, at: ago(75), policyRevision: 1 },
      {
        decision: "held",
        actorId: MODERATOR,
        at: ago(30),
        policyRevision: 2,
        note: "Held while the seller confirms which board revision ships: the photos show the earlier layout without the current-limit trimmer.",
      },
      { decision: "restored", actorId: MODERATOR, at: ago(28), policyRevision: 2, note: "The seller sent photos of the revision that ships; restored." },
      { decision: "grace_notice", actorId: null, at: ago(2), policyRevision: 3 },
    ],
  },
  {
    id: RETIRED_ID,
    sellerId: KIT_SELLER,
    kind: "board",
    title: "0–30 V 3 A bench supply board (first revision)",
    slug: "bench-supply-board-30v-3a-rev1",
    descriptionMd:
      "The first revision of the cooperative's small bench supply: a linear regulator with a current limit, fed from the secondary of a separate isolating transformer.\n\nRetired: the 0–60 V board replaces it.",
    priceMinor: 3400,
    stock: 0,
    shippingWeightG: 300,
    photo: "board-bench-supply",
    declaration: { mainsConnected: false, liveHeatsinks: false, weldingSource: false },
    notes: [codesNote],
    state: "retired",
    story: ({ ago }) => [
      { decision: "submitted", actorId: KIT_SELLER, at: ago(88), policyRevision: 1 },
      { decision: "approved", actorId: MODERATOR, at: ago(87), policyRevision: 1 },
      { decision: "retired", actorId: KIT_SELLER, at: ago(50), policyRevision: 2 },
    ],
  },
];
