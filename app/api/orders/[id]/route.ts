import { NextResponse } from "next/server";
import { getOrderDetail } from "@/db/queries/orders";
import { guardRoute } from "@/lib/auth/guard";

export const dynamic = "force-dynamic";

/** GET /api/orders/[id] — the order as its buyer or its seller sees it; 404 to anyone else. */
export const GET = guardRoute<{ id: string }>(undefined, async (_request, user, { params }) => {
  const { id } = await params;
  const detail = (await getOrderDetail(id, user.id, "buyer")) ?? (await getOrderDetail(id, user.id, "seller"));
  if (!detail) return NextResponse.json({ error: "not_found", message: "No such order." }, { status: 404 });
  return NextResponse.json(detail);
});
