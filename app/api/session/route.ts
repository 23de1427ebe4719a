import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import type { HeaderSession } from "@/components/site/nav-links";

export const dynamic = "force-dynamic";

/**
 * GET /api/session → { user: { label, roles } | null }: who the site header names, fetched after the
 * page loads so the pages themselves can be cached. Only what the header shows; never cached.
 */
export async function GET(): Promise<Response> {
  const user = await getSessionUser();
  const body: HeaderSession = { user: user ? { label: user.name ?? user.email ?? "Your account", roles: user.roles } : null };
  return NextResponse.json(body, { headers: { "cache-control": "private, no-store" } });
}
