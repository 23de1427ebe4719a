import { NextResponse } from "next/server";
import { listUsers } from "@/db/queries/users";
import { guardRoute } from "@/lib/auth/guard";
import { userSearchSchema } from "@/lib/validations/admin";

export const dynamic = "force-dynamic";

export const GET = guardRoute(["admin"], async (request) => {
  const parsed = userSearchSchema.safeParse({ q: new URL(request.url).searchParams.get("q") ?? undefined });
  if (!parsed.success) {
    return NextResponse.json({ error: "invalid_input", message: "The search is too long.", fieldErrors: { q: ["at most 200 characters"] } }, { status: 422 });
  }
  const users = await listUsers({ search: parsed.data.q });
  return NextResponse.json({ users });
});
