// Demo listings of the Larkspur Yard cooperative: invented parts with physically plausible figures,
// one listing in each state a buyer, seller or moderator meets. All figures SI.
import type { MagneticFigures } from "@/lib/validations/listings";
import type { SafetyDeclaration, SafetyNote } from "@/lib/policy";
import type { BringUpStage, ListingKind, ListingState, MagneticSubtype } from "./schema/listings";

export type DemoListing = {
  id: string;
  sellerId: string;
  kind: ListingKind;
  magneticSubtype?: MagneticSubtype;
  title: string;
  slug: string;
  descriptionMd: string;
  priceMinor: number;
  stock: number;
  shippingWeightG: number;
  state: ListingState;
  photo: string;
  figures: MagneticFigures | Record<string, never>;
  declaration: SafetyDeclaration;
  notes: SafetyNote[];
  checkpoints?: { stage: BringUpStage; name: string; measure: string; unit: string; min: number; max: number }[];
  requirements?: { subtype: MagneticSubtype; label: string; minInductanceH?: number; atCurrentA?: number }[];
  moderatorMessage?: string;
  reasons?: { topic: string; text: string }[];
};

const KIT_SELLER = "demo-seller-kits";
const MAGNETICS_SELLER = "demo-seller-magnetics";

const notMains: SafetyDeclaration = { mainsConnected: false, liveHeatsinks: false, weldingSource: false };

export const codesNote: SafetyNote = {
  topic: "codes-and-competence",
  text: "Building and connecting this part is work on mains equipment: follow your local electrical code, and have a licensed electrician check the finished build before it is used by anyone.",
};

const weldingKitNotes: SafetyNote[] = [
  {
    topic: "mains-isolation",
    text: "Unplug the mains lead before opening the case; the mains switch on the front panel breaks both live and neutral, but the input terminals stay live while the lead is plugged in.",
  },
  {
    topic: "protective-earth",
    text: "The case, the front panel and the output terminal frame are bonded to protective earth with a 2.5 mm² green-yellow lead; check below 0.1 Ω from the plug's earth pin to the case before the first power-up.",
  },
  {
    topic: "first-power-up",
    text: "Power the control board alone from a bench supply first. Then bring mains up through a series lamp of about 100 W: the lamp glows briefly while the bus charges and must go dark at idle; a lamp that stays bright means a fault, so switch off and discharge.",
  },
  {
    topic: "stored-charge",
    text: "The 1360 µF bus holds about 87 J at 358 V. The 33 kΩ bleeder brings it below 60 V in about 80 s: wait at least two minutes after unplugging, then confirm with a meter across the bus terminals before touching anything.",
    waitSeconds: 120,
  },
  {
    topic: "live-heatsinks",
    text: "The primary heatsink sits at bus potential: it is mounted on insulated standoffs, carries a warning label, and must never be touched while the bus is charged.",
  },
  {
    topic: "output-voltage",
    text: "The open-circuit output is 62 V DC, well under the 113 V peak limit of the arc-welding standard for normal environments; the output is isolated from mains by the main transformer.",
  },
  {
    topic: "arc-hazards",
    text: "Wear a welding helmet with the right shade, gloves and flame-resistant clothing; weld with ventilation or fume extraction, and keep anything that burns well away from the work.",
  },
  codesNote,
];

export const DEMO_LISTINGS: DemoListing[] = [
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000001",
    sellerId: KIT_SELLER,
    kind: "kit",
    title: "160 A half-bridge stick-welder kit",
    slug: "160a-half-bridge-stick-welder-kit",
    descriptionMd:
      "A complete kit for a **160 A MMA (stick) welding inverter** on 230 V mains: main board with the rectifier, 1360 µF bus and half-bridge, the control and gate-drive board, heatsinks, case parts and a wiring loom.\n\n" +
      "You also need the main transformer and the output choke (see *Magnetics this kit needs*), and a current-sense transformer.\n\n" +
      "- Output 20–160 A at 60 % duty cycle\n- Open-circuit voltage 62 V DC\n- Switching at 40 kHz\n\nThe bring-up checkpoints below follow the usual order: control supply first, then mains through a series lamp.",
    priceMinor: 18900,
    stock: 4,
    shippingWeightG: 4200,
    state: "live",
    photo: "kit-stick-welder",
    figures: {},
    declaration: {
      mainsConnected: true,
      mainsVrms: 230,
      mainsTolerance: 0.1,
      busCapacitanceF: 1360e-6,
      bleederOhm: 33e3,
      liveHeatsinks: true,
      weldingSource: true,
      openCircuitV: 62,
      ocvKind: "dc",
      environment: "normal",
    },
    notes: weldingKitNotes,
    checkpoints: [
      { stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer primary", unit: "kHz", min: 38, max: 42 },
      { stage: "control-supply", name: "Gate-drive duty cycle", measure: "Duty cycle of one gate signal", unit: "%", min: 40, max: 48 },
      { stage: "control-supply", name: "Control supply current", measure: "Current from the 15 V bench supply", unit: "mA", min: 80, max: 150 },
      { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the 100 W series lamp in circuit", unit: "V", min: 290, max: 335 },
      { stage: "series-lamp", name: "Open-circuit output", measure: "Voltage across the output terminals, no load", unit: "V", min: 55, max: 66 },
      { stage: "series-lamp", name: "Idle input current", measure: "Mains current at idle", unit: "A", min: 0.05, max: 0.4 },
      { stage: "low-current", name: "Current-limit response", measure: "Output current into a 0.1 Ω load with the dial at minimum", unit: "A", min: 18, max: 30 },
      { stage: "rated-load", name: "Primary heatsink temperature", measure: "Heatsink temperature after 5 min at 120 A", unit: "°C", min: 20, max: 75 },
      { stage: "rated-load", name: "Maximum output current", measure: "Output current with the dial at maximum", unit: "A", min: 150, max: 170 },
    ],
    requirements: [
      { subtype: "choke", label: "Output choke", minInductanceH: 18e-6, atCurrentA: 110 },
      { subtype: "transformer", label: "Main transformer", atCurrentA: 110 },
      { subtype: "current-transformer", label: "Current-sense transformer" },
    ],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000002",
    sellerId: KIT_SELLER,
    kind: "board",
    title: "Two-transistor forward gate-drive and control board",
    slug: "forward-gate-drive-control-board",
    descriptionMd:
      "Control board for two-transistor forward converters: a fixed-frequency PWM controller at 40 kHz, peak current limiting from a current transformer, soft start, and an isolated gate-drive transformer stage for both switches.\n\nRuns from a 15 V auxiliary supply; it never connects to mains itself.",
    priceMinor: 4650,
    stock: 12,
    shippingWeightG: 180,
    state: "live",
    photo: "board-gate-drive",
    figures: {},
    declaration: notMains,
    notes: [
      {
        topic: "codes-and-competence",
        text: "The board runs from 15 V, but the converter it drives sits on a mains bus: follow your local electrical code and have the finished build checked by a licensed electrician.",
      },
    ],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000003",
    sellerId: MAGNETICS_SELLER,
    kind: "magnetic",
    magneticSubtype: "choke",
    title: "Output choke 20 µH / 110 A, stacked ferrite E cores",
    slug: "output-choke-20uh-110a",
    descriptionMd:
      "Hand-wound output choke for welding inverters: two stacked ferrite E cores (10.7 cm² together) with a 3.3 mm total gap and 7 turns of copper strip, 30 mm².\n\nRated 110 A peak at 0.29 T. Terminals are M6 brass studs.",
    priceMinor: 6400,
    stock: 6,
    shippingWeightG: 1300,
    state: "live",
    photo: "choke-output",
    figures: {
      coreMaterial: "mnzn-ferrite",
      coreAreaM2: 1.07e-3,
      pathLengthM: 0.147,
      gapM: 3.3e-3,
      meanTurnLengthM: 0.16,
      windings: [{ name: "main", role: "winding", turns: 7, material: "copper", areaM2: 30e-6, strands: 1, currentA: 90 }],
      ratedCurrentA: 110,
      switchingFrequencyHz: 40e3,
    },
    declaration: notMains,
    notes: [codesNote],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000004",
    sellerId: MAGNETICS_SELLER,
    kind: "magnetic",
    magneticSubtype: "transformer",
    title: "Main transformer for a 40 kHz forward converter, 36:7",
    slug: "main-transformer-40khz-36-7",
    descriptionMd:
      "Main power transformer for two-transistor forward welding inverters on a 325 V bus: 36 primary turns of Litz wire, 7 secondary turns of copper strip, interleaved, with 3 kV insulation between windings.\n\nSecondary peak about 63 V, for a 62 V DC open-circuit output.",
    priceMinor: 9800,
    stock: 3,
    shippingWeightG: 1600,
    state: "live",
    photo: "transformer-main",
    figures: {
      coreMaterial: "mnzn-ferrite",
      coreAreaM2: 5.35e-4,
      pathLengthM: 0.147,
      gapM: 0,
      alNh: 7000,
      meanTurnLengthM: 0.13,
      windings: [
        { name: "primary", role: "primary", turns: 36, material: "copper", areaM2: 4e-6, strands: 200, currentA: 18 },
        { name: "secondary", role: "secondary", turns: 7, material: "copper", areaM2: 40e-6, strands: 1, currentA: 110 },
      ],
      ratedCurrentA: 110,
      switchingFrequencyHz: 40e3,
      primaryVoltageV: 325,
    },
    declaration: { mainsConnected: false, liveHeatsinks: false, weldingSource: false },
    notes: [
      {
        topic: "codes-and-competence",
        text: "The primary of this transformer sits on the rectified mains bus once fitted: follow your local electrical code and have the finished build checked by a licensed electrician.",
      },
    ],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000005",
    sellerId: MAGNETICS_SELLER,
    kind: "magnetic",
    magneticSubtype: "current-transformer",
    title: "Current-sense transformer 1:100 on a ferrite toroid",
    slug: "current-sense-transformer-1-100",
    descriptionMd: "A 1:100 current transformer for peak current limiting: 100 turns of 0.3 mm wire on a ferrite toroid, single-turn primary through the centre.",
    priceMinor: 1450,
    stock: 20,
    shippingWeightG: 40,
    state: "held",
    photo: "ct-current-sense",
    figures: {
      coreMaterial: "mnzn-ferrite",
      coreAreaM2: 4.5e-5,
      pathLengthM: 0.055,
      gapM: 0,
      alNh: 2500,
      windings: [{ name: "secondary", role: "secondary", turns: 100, material: "copper", areaM2: 7.07e-8, strands: 1, currentA: 1.1 }],
      ratedCurrentA: 110,
      switchingFrequencyHz: 40e3,
    },
    declaration: notMains,
    notes: [codesNote],
    moderatorMessage: "Held while the seller confirms the insulation rating between the primary conductor and the secondary winding.",
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000006",
    sellerId: KIT_SELLER,
    kind: "kit",
    title: "2 kW induction heater kit, 230 V",
    slug: "2kw-induction-heater-kit",
    descriptionMd: "A 2 kW series-resonant induction heater on 230 V mains with a 30 kHz work coil, water-cooled, with a half-bridge on a 10 µF film bus.",
    priceMinor: 21500,
    stock: 2,
    shippingWeightG: 5200,
    state: "in_review",
    photo: "kit-induction-heater",
    figures: {},
    declaration: { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 10e-6, bleederOhm: 100e3, liveHeatsinks: true, weldingSource: false },
    notes: [
      { topic: "mains-isolation", text: "Unplug the mains lead before opening the case; the double-pole switch on the rear breaks live and neutral, but the input filter stays live while plugged in." },
      { topic: "protective-earth", text: "The case, the coil's water manifold and the mounting plate are bonded to protective earth; check below 0.1 Ω from the plug's earth pin before power-up." },
      { topic: "first-power-up", text: "Run the driver board from a bench supply first, then bring mains up through a 100 W series lamp with no workpiece in the coil; the lamp must go dark once the bus has charged." },
      { topic: "stored-charge", text: "The 10 µF bus stores about 0.6 J at 358 V; the 100 kΩ bleeder takes it below 60 V in under two seconds. Wait ten seconds and confirm with a meter before touching.", waitSeconds: 10 },
      { topic: "live-heatsinks", text: "Both switch heatsinks are at bus potential, on insulated standoffs and behind a perforated cover with a warning label; never touch them with the lead plugged in." },
      codesNote,
    ],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000007",
    sellerId: KIT_SELLER,
    kind: "board",
    title: "0–60 V 5 A bench supply board",
    slug: "bench-supply-board-60v-5a",
    descriptionMd: "A linear-regulated bench supply board with a pre-regulating buck stage, for a mains transformer of 2 × 24 V.",
    priceMinor: 5900,
    stock: 8,
    shippingWeightG: 350,
    state: "sent_back",
    photo: "board-bench-supply",
    figures: {},
    declaration: { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 0, liveHeatsinks: false, weldingSource: false },
    notes: [
      { topic: "mains-isolation", text: "The mains transformer's primary is fused and switched double-pole on the rear panel; unplug before opening." },
      { topic: "protective-earth", text: "Bond the case to earth." },
      { topic: "first-power-up", text: "Use a series lamp of about 100 W for the first power-up, with no load connected, and check the transformer's secondary voltages first." },
      codesNote,
    ],
    moderatorMessage: "Protective earth: say which parts are bonded and how to check the earth connection (at least 12 words).",
    reasons: [{ topic: "protective-earth", text: "Say which metal parts are bonded to earth and how a builder checks the connection." }],
  },
  {
    id: "0b7d1c3e-5a21-4c6e-9f10-000000000008",
    sellerId: KIT_SELLER,
    kind: "kit",
    title: "Lead-acid battery charger kit, 12/24 V 20 A",
    slug: "battery-charger-kit-12-24v",
    descriptionMd: "Draft: a mains-powered three-stage charger for 12 V and 24 V lead-acid batteries.",
    priceMinor: 11900,
    stock: 0,
    shippingWeightG: 2600,
    state: "draft",
    photo: "board-bench-supply",
    figures: {},
    declaration: { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 470e-6, liveHeatsinks: false, weldingSource: false },
    notes: [],
  },
];
