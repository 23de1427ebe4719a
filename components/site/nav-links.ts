import type { Role } from "@/db/schema/users";
import { hasRole, type SessionUser } from "@/lib/auth/access";

export type NavLink = { href: string; label: string };

/** The header's links for a person: what every visitor sees, then one link per area they may enter. */
export function navLinksFor(user: SessionUser | null): NavLink[] {
  const links: NavLink[] = [
    { href: "/catalog", label: "Catalog" },
    { href: "/workbench", label: "Workbench" },
    { href: "/questions", label: "Questions" },
    { href: "/reviewers", label: "Reviewers" },
    { href: "/cart", label: "Cart" },
  ];
  const areas: { role: Role; link: NavLink }[] = [
    { role: "member", link: { href: "/bench", label: "My bench" } },
    { role: "member", link: { href: "/orders", label: "Orders" } },
    { role: "member", link: { href: "/reviews", label: "Reviews" } },
    { role: "seller", link: { href: "/sell", label: "Seller desk" } },
    { role: "moderator", link: { href: "/moderate", label: "Moderation" } },
    { role: "admin", link: { href: "/admin/users", label: "People & roles" } },
    { role: "admin", link: { href: "/admin/policy", label: "Policy" } },
    { role: "admin", link: { href: "/admin/fee", label: "Fee" } },
  ];
  for (const { role, link } of areas) if (hasRole(user, role)) links.push(link);
  return links;
}
