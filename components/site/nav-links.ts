import type { Role } from "@/db/schema/users";
import { effectiveRoles } from "@/lib/auth/access";

export type NavLink = { href: string; label: string };

/** What GET /api/session answers: who the header names, and the roles its links depend on. */
export type HeaderUser = { label: string; roles: Role[] };
export type HeaderSession = { user: HeaderUser | null };

/** What every visitor sees, and what the header renders before it knows who is signed in. */
export const PUBLIC_LINKS: readonly NavLink[] = [
  { href: "/catalog", label: "Catalog" },
  { href: "/workbench", label: "Workbench" },
  { href: "/questions", label: "Questions" },
  { href: "/reviewers", label: "Reviewers" },
  { href: "/cart", label: "Cart" },
];

const AREAS: readonly { role: Role; link: NavLink }[] = [
  { role: "member", link: { href: "/bench", label: "My bench" } },
  { role: "member", link: { href: "/orders", label: "Orders" } },
  { role: "member", link: { href: "/reviews", label: "Reviews" } },
  { role: "seller", link: { href: "/sell", label: "Seller desk" } },
  { role: "moderator", link: { href: "/moderate", label: "Moderation" } },
  { role: "admin", link: { href: "/admin/users", label: "People & roles" } },
  { role: "admin", link: { href: "/admin/policy", label: "Policy" } },
  { role: "admin", link: { href: "/admin/fee", label: "Fee" } },
];

/** One link per area a signed-in person may enter; none for a visitor. */
export function areaLinksFor(user: { roles: readonly Role[] } | null): NavLink[] {
  if (!user) return [];
  const roles = effectiveRoles(user.roles);
  return AREAS.filter(({ role }) => roles.has(role)).map(({ link }) => link);
}

/** The header's links for a person: what every visitor sees, then one link per area they may enter. */
export function navLinksFor(user: { roles: readonly Role[] } | null): NavLink[] {
  return [...PUBLIC_LINKS, ...areaLinksFor(user)];
}
