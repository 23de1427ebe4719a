import { NextResponse } from "next/server";
import { changeRole, NotFoundError } from "@/db/queries/users";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError, parseJsonBody } from "@/lib/http/json";
import { roleChangeSchema, userIdSchema } from "@/lib/validations/admin";
import type { Role } from "@/db/schema/users";

export const dynamic = "force-dynamic";

export const POST = guardRoute<{ id: string }>(["admin"], async (request, admin, { params }) => {
  const { id } = await params;
  // An id PostgreSQL could not even compare names nobody.
  if (!userIdSchema.safeParse(id).success) return jsonError(404, "not_found", "No such user.");
  // The shared reader: a size limit before parsing, and field errors (or "" for the body as a whole).
  const parsed = await parseJsonBody(request, roleChangeSchema);
  if (!parsed.ok) return parsed.response;
  const { role, grant } = parsed.data;
  if (id === admin.id && role === "admin" && !grant) {
    return NextResponse.json({ error: "conflict", message: "You cannot revoke your own admin role; ask another admin." }, { status: 409 });
  }
  try {
    const result = await changeRole({ actorId: admin.id, userId: id, role: role as Role, grant });
    return NextResponse.json({ ok: true, changed: result.changed });
  } catch (error) {
    if (error instanceof NotFoundError) return NextResponse.json({ error: "not_found", message: error.message }, { status: 404 });
    console.error("[admin/roles]", error);
    return NextResponse.json({ error: "server_error", message: "The change could not be saved." }, { status: 500 });
  }
});
