import "server-only";
import { cache } from "react";
import { NextResponse } from "next/server";
import type { Role } from "@/db/schema/users";
import { getUserWithRoles } from "@/db/queries/users";
import { auth } from "./config";
import { decideAccess, type AccessDecision, type SessionUser } from "./access";

/** The signed-in person with their roles, read once per request. */
export const getSessionUser = cache(async (): Promise<SessionUser | null> => {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  return getUserWithRoles(id);
});

export async function checkAccess(anyOf?: readonly Role[]): Promise<AccessDecision> {
  return decideAccess(await getSessionUser(), anyOf);
}

export class AccessDeniedError extends Error {
  constructor(readonly status: 401 | 403, message: string) {
    super(message);
    this.name = "AccessDeniedError";
  }
}

/** For server actions and server code: returns the user or throws AccessDeniedError. */
export async function requireUser(anyOf?: readonly Role[]): Promise<SessionUser> {
  const decision = await checkAccess(anyOf);
  if (!decision.ok) throw new AccessDeniedError(decision.status, decision.reason);
  return decision.user;
}

type RouteContext<P> = { params: Promise<P> };

/** For route handlers: 401/403 JSON before the handler runs. */
export function guardRoute<P = Record<string, string>>(
  anyOf: readonly Role[] | undefined,
  handler: (request: Request, user: SessionUser, context: RouteContext<P>) => Promise<Response>,
) {
  return async (request: Request, context: RouteContext<P>): Promise<Response> => {
    const decision = await checkAccess(anyOf);
    if (!decision.ok) {
      const error = decision.status === 401 ? "not_signed_in" : "forbidden";
      return NextResponse.json({ error, message: decision.reason }, { status: decision.status });
    }
    return handler(request, decision.user, context);
  };
}
