import { NextResponse } from "next/server";
import { listUsers } from "@/db/queries/users";
import { guardRoute } from "@/lib/auth/guard";
import { fieldErrorsFromZod, invalidInput } from "@/lib/http/json";
import { userSearchSchema } from "@/lib/validations/admin";

export const dynamic = "force-dynamic";

export const GET = guardRoute(["admin"], async (request) => {
  const parsed = userSearchSchema.safeParse({ q: new URL(request.url).searchParams.get("q") ?? undefined });
  if (!parsed.success) return invalidInput("The search is not valid.", fieldErrorsFromZod(parsed.error));
  const users = await listUsers({ search: parsed.data.q });
  return NextResponse.json({ users });
});
