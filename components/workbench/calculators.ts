/** The workbench calculators, in the order a build meets them: the bus, the magnetics, the output. */
export interface WorkbenchCalculator {
  slug: "mains" | "inductor" | "transformer" | "winding" | "welding-output";
  href: string;
  title: string;
  /** the question it answers, in one line */
  question: string;
}

export const WORKBENCH_CALCULATORS: readonly WorkbenchCalculator[] = [
  {
    slug: "mains",
    href: "/workbench/mains",
    title: "Mains bus and bleeder",
    question:
      "How high the rectified bus charges, what it stores, and how long it takes to fall to 60\u00a0V after switch-off.",
  },
  {
    slug: "inductor",
    href: "/workbench/inductor",
    title: "Choke and inductor",
    question: "What inductance the turns give, and how close the rated current takes the core to saturation.",
  },
  {
    slug: "transformer",
    href: "/workbench/transformer",
    title: "Transformer turns",
    question:
      "How many primary turns keep the core within its flux at the drive voltage, and the turns ratio for the secondary.",
  },
  {
    slug: "winding",
    href: "/workbench/winding",
    title: "Winding wire",
    question:
      "What a winding costs in resistance, loss and current density, and whether the strands suit the switching frequency.",
  },
  {
    slug: "welding-output",
    href: "/workbench/welding-output",
    title: "Welding output",
    question:
      "Whether the open-circuit voltage is within the standard's limit, and the load voltage the source must hold across its range.",
  },
];

export function workbenchCalculator(slug: WorkbenchCalculator["slug"]): WorkbenchCalculator {
  const found = WORKBENCH_CALCULATORS.find((c) => c.slug === slug);
  if (!found) throw new Error(`No workbench calculator ${slug}`);
  return found;
}
