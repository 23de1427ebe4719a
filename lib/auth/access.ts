import type { Role } from "@/db/schema/users";

// Pure access decisions, shared by pages, server actions and route handlers.

export type SessionUser = { id: string; email: string | null; name: string | null; roles: Role[] };

export type Requirement = { signedIn: true; anyOf?: readonly Role[] };

export type AccessDecision = { ok: true; user: SessionUser } | { ok: false; status: 401 | 403; reason: string };

/** Every signed-in person is a member; staff roles do not imply one another except admin ⊇ moderator. */
export function effectiveRoles(roles: readonly Role[]): Set<Role> {
  const set = new Set<Role>(roles);
  set.add("member");
  if (set.has("admin")) set.add("moderator");
  return set;
}

export function hasRole(user: SessionUser | null, role: Role): boolean {
  return user !== null && effectiveRoles(user.roles).has(role);
}

export function decideAccess(user: SessionUser | null, anyOf?: readonly Role[]): AccessDecision {
  if (!user) return { ok: false, status: 401, reason: "Sign in to continue." };
  if (anyOf && anyOf.length > 0 && !anyOf.some((role) => hasRole(user, role))) {
    return { ok: false, status: 403, reason: `This needs the ${anyOf.join(" or ")} role.` };
  }
  return { ok: true, user };
}
