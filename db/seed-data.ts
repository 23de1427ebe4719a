// The demo is set in an invented scenario: the Larkspur Yard makers' cooperative, a shared workshop
// whose members wind magnetics, lay out boards and bring up each other's builds. Nobody here is real.
import type { Role } from "./schema/users";

export type DemoAccount = { id: string; email: string; name: string; roles: Role[]; about: string };

export const DEMO_DOMAIN = "larkspur.test";

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { id: "demo-admin", email: `oriel.admin@${DEMO_DOMAIN}`, name: "Oriel Vantongeren", roles: ["member", "admin"], about: "runs the platform for the cooperative" },
  { id: "demo-moderator", email: `sefa.moderator@${DEMO_DOMAIN}`, name: "Sefa Marchetti-Obi", roles: ["member", "moderator"], about: "checks safety sheets and the Q&A" },
  { id: "demo-seller-magnetics", email: `idunn.winds@${DEMO_DOMAIN}`, name: "Idunn Kaszuba", roles: ["member", "seller"], about: "winds transformers and chokes on the yard's lathe" },
  { id: "demo-seller-kits", email: `bram.kits@${DEMO_DOMAIN}`, name: "Bram Oyelaran", roles: ["member", "seller"], about: "designs inverter boards and kits" },
  { id: "demo-reviewer", email: `tamsin.reviews@${DEMO_DOMAIN}`, name: "Tamsin Achterberg", roles: ["member", "reviewer"], about: "has brought up dozens of welding inverters" },
  { id: "demo-builder", email: `noor.builds@${DEMO_DOMAIN}`, name: "Noor Delacroix-Haidari", roles: ["member"], about: "is building a first stick-welding inverter" },
  { id: "demo-builder-2", email: `jory.builds@${DEMO_DOMAIN}`, name: "Jory Okonkwo-Lind", roles: ["member"], about: "brings up an induction heater of her own design, and has applied to review" },
  { id: "demo-applicant", email: `pim.cores@${DEMO_DOMAIN}`, name: "Pim Adeyemi-Roos", roles: ["member"], about: "is new, has applied to sell gapped cores and waits for a moderator" },
  { id: "demo-member-declined", email: `vesna.parts@${DEMO_DOMAIN}`, name: "Vesna Holmqvist", roles: ["member"], about: "had her applications declined and her posts hidden or removed" },
];

export type DemoSeller = {
  userId: string;
  applicationId: string;
  shopName: string;
  slug: string;
  country: string;
  profileMd: string;
  returnsPolicyMd: string;
  returnsWindowDays: number;
};

export const DEMO_SELLERS: DemoSeller[] = [
  {
    userId: "demo-seller-kits",
    applicationId: "5e11e700-0000-4000-8000-000000000001",
    shopName: "Oyelaran Bench Kits",
    slug: "oyelaran-bench-kits",
    country: "NL",
    profileMd: "Inverter boards and complete kits, designed and tested at the Larkspur Yard workshop. Every kit ships with bring-up checkpoints.",
    returnsPolicyMd: "Unused kits in their original bags can be returned within **30 days**. Boards that have been soldered cannot be returned.",
    returnsWindowDays: 30,
  },
  {
    userId: "demo-seller-magnetics",
    applicationId: "5e11e700-0000-4000-8000-000000000002",
    shopName: "Kaszuba Windings",
    slug: "kaszuba-windings",
    country: "PL",
    profileMd: "Hand-wound transformers, chokes and current transformers, each measured before it ships: inductance, turns ratio and insulation.",
    returnsPolicyMd: "Wound parts made to order cannot be returned; stock parts within **14 days**, unmounted.",
    returnsWindowDays: 14,
  },
];

export const DEMO_REVIEWER = {
  userId: "demo-reviewer",
  expertise: ["welding-inverters", "gate-drive", "magnetics"],
  profileMd:
    "I have brought up a few dozen half-bridge and forward welding inverters at the Larkspur Yard bench. I look hardest at the series-lamp stage: bus voltage, idle current and what the gate drive does when mains first arrives.",
  priceMinor: 4500,
};
