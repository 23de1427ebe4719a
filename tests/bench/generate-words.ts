// Words the generated catalog is written in: trade terms of power electronics and invented
// series and shop names. No brands, no real shops, no manufacturers' part numbers; core sizes
// are the generic shape-and-size names of the core standards (EE, ETD, PQ, toroid).

/** Invented model-line names a seller might give a range of parts. */
export const SERIES = [
  "Orvik", "Tamsel", "Kestrin", "Valmor", "Quenby", "Larrow", "Pellin", "Sorrak", "Wendrel", "Ibbet",
  "Corvane", "Dunmarsh", "Hesketh", "Ulvane", "Brackley", "Myrtal", "Ostrel", "Fennick", "Garrowin", "Thessaly",
] as const;

/** Invented first halves of shop names; the suffixes are ordinary words. */
export const SHOP_WORDS = ["Copperhollow", "Gapwright", "Bobbinhall", "Coilmere", "Ferrowick", "Lampbench", "Busbar Row", "Toroidal Lane", "Snubberfield", "Windle Cross"] as const;
export const SHOP_SUFFIXES = ["Windings", "Bench", "Works", "Magnetics", "Kits", "Boards", "Supply", "Cooperative"] as const;
export const COUNTRIES = ["DE", "NL", "FR", "SE", "PL", "CZ", "AT", "DK", "FI", "IE"] as const;

export const FIRST_NAMES = ["Ada", "Bex", "Cai", "Dov", "Esme", "Fen", "Gil", "Hale", "Ines", "Jory", "Kit", "Lune", "Milo", "Nell", "Oren", "Pia", "Quin", "Rue", "Sol", "Tove"] as const;
export const LAST_NAMES = ["Ashcombe", "Brindle", "Coldharbour", "Dunmore", "Elsworth", "Fairweather", "Greaves", "Holloway", "Ivesley", "Jarrow"] as const;

export const CORE_SHAPES = ["EE", "ETD", "PQ", "EI", "U-core", "toroid", "pot core", "EFD"] as const;
export const CORE_SIZES: Record<(typeof CORE_SHAPES)[number], readonly string[]> = {
  EE: ["EE42", "EE55", "EE65", "EE70"],
  ETD: ["ETD39", "ETD44", "ETD49", "ETD59"],
  PQ: ["PQ35", "PQ40", "PQ50"],
  EI: ["EI60", "EI76"],
  "U-core": ["U93", "U100"],
  toroid: ["T40", "T63", "T80"],
  "pot core": ["P36", "P42"],
  EFD: ["EFD25", "EFD30"],
};

export const MATERIAL_WORDS: Record<string, string> = {
  "mnzn-ferrite": "ferrite",
  "iron-powder": "iron powder",
  "silicon-steel": "silicon steel",
  amorphous: "amorphous",
  nanocrystalline: "nanocrystalline",
};

export const WIRE_WORDS = ["litz", "copper foil", "enamelled round wire", "flat wire", "triple-insulated wire", "stranded litz"] as const;

export const CHOKE_USES = ["output choke", "PFC choke", "filter choke", "buck choke", "resonant choke", "common-mode choke"] as const;
export const TRANSFORMER_USES = ["main transformer", "gate-drive transformer", "auxiliary transformer", "flyback transformer", "push-pull transformer"] as const;
export const CT_USES = ["current-sense transformer", "current transformer", "primary-current sensor"] as const;

export const BOARD_TYPES = [
  "half-bridge inverter board",
  "full-bridge power board",
  "two-transistor forward power board",
  "gate-drive and control board",
  "PFC front-end board",
  "soft-start and rectifier board",
  "bench supply regulator board",
  "induction heater driver board",
  "charger control board",
  "snubber and clamp board",
] as const;

export type KitType = "welder" | "tig" | "heater" | "supply" | "charger" | "spot";
export const KIT_TITLES: Record<KitType, readonly string[]> = {
  welder: ["{A} A stick-welder kit", "{A} A MMA inverter kit", "{A} A half-bridge welder kit"],
  tig: ["{A} A TIG inverter kit", "{A} A DC TIG welder kit"],
  heater: ["{P} kW induction heater kit", "{P} kW series-resonant heater kit"],
  supply: ["0–{V} V {I} A bench supply kit", "{V} V {I} A lab supply kit"],
  charger: ["12/24 V {I} A battery charger kit", "three-stage charger kit, {I} A"],
  spot: ["capacitor-discharge spot-welder kit", "{A} A spot-welder kit"],
};

/** Sentences for descriptions; {…} is filled with a figure. Trade talk only. */
export const DESCRIPTION_SENTENCES = [
  "Switching at {f} kHz with soft start and cycle-by-cycle current limiting.",
  "Wound with {strands}-strand litz to keep AC resistance low at the switching frequency.",
  "Hi-pot tested at {kv} kV for one minute between windings before it ships.",
  "Ships with a printed winding sheet and the measured inductance of this very part.",
  "The bus capacitors total {uf} µF; a bleeder is fitted across them.",
  "The air gap is set with spacers in the centre leg and the core halves are bonded.",
  "Vacuum-varnished and baked, so the winding does not sing under load.",
  "Every board is flying-probe tested and the gate drive is checked on a dummy load.",
  "The layout keeps the high-current loop short and the gate traces away from the switch node.",
  "Heatsink mounting holes fit the usual extrusions; thermal pads are included.",
  "The current limit is set with a single trimmer and holds to within five per cent.",
  "Screw terminals take up to {mm2} mm² leads for the output.",
  "A series-lamp bring-up is described step by step in the build notes.",
  "Interleaved primary and secondary keep leakage inductance low.",
  "The creepage between primary and secondary is at least {creep} mm on the bobbin.",
  "Made to order in our workshop; allow a week for winding and testing.",
  "Spare bobbins and clips are available on request.",
  "Works with the usual two-transistor forward and half-bridge topologies.",
  "The snubber values are chosen for the stated switching frequency and can be changed.",
  "Tested at rated current for an hour with the temperature rise logged.",
] as const;

export const QUESTION_TITLES = [
  "Bus voltage reads {v} V behind the series lamp, is that normal?",
  "Which output choke suits a {a} A build?",
  "Gate-drive waveform rings at turn-off",
  "How long should I wait after unplugging before touching the bus?",
  "Series lamp stays bright at idle",
  "Transformer hums at no load",
  "Current limit trips at {a} A instead of the dial setting",
  "Heatsink temperature after five minutes at rated load",
  "Can I use a larger bleeder resistor?",
  "Open-circuit voltage higher than expected",
  "Litz or foil for the secondary?",
  "Snubber resistor runs hot",
] as const;

export const POST_SENTENCES = [
  "I powered the control board from the bench supply first and the gate signals look clean.",
  "With the 100 W lamp in series the lamp flashes once and then goes dark.",
  "I measured the bus with a meter across the capacitor terminals after unplugging.",
  "The scope shows some overshoot at the switch node, roughly {p} per cent.",
  "Check the gap spacers first; a thin gap drops the saturation current a lot.",
  "The reading is inside the range on the checkpoint, so carry on to the next stage.",
  "Discharge the bus through a resistor and confirm with a meter before you touch anything.",
  "Your idle current is on the high side; look at the snubber and the gate resistor.",
  "I wound it with {n} turns as the sheet says and the inductance came out close.",
  "Thanks, that was it: one of the diodes was in backwards.",
] as const;
