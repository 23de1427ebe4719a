import type { Role } from "@/db/schema/users";

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  member: "Buy parts, keep bring-up logs, ask and answer on the bench, book reviews.",
  seller: "List boards, magnetics and kits; manage stock and orders; see payouts.",
  reviewer: "Offer paid reviews of builders' bring-up logs and write review reports.",
  moderator: "Check listings against the safety policy, moderate questions, vet reviewers.",
  admin: "Everything a moderator does, plus roles, the platform fee and policy revisions.",
};
