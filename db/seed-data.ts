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
];
