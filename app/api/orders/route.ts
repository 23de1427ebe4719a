import { NextResponse } from "next/server";
import { listBuyerOrders, listSellerOrders } from "@/db/queries/orders";
import { hasRole } from "@/lib/auth/access";
import { guardRoute } from "@/lib/auth/guard";
import { sellerOrdersQuerySchema } from "@/lib/validations/orders";

export const dynamic = "force-dynamic";

/** GET /api/orders — the signed-in buyer's orders; `?as=seller&state=&sort=&dir=&page=` — a seller's incoming orders. */
export const GET = guardRoute(undefined, async (request, user) => {
  const url = new URL(request.url);
  const page = sellerOrdersQuerySchema.shape.page.parse(url.searchParams.get("page") ?? undefined);
  if (url.searchParams.get("as") === "seller") {
    if (!hasRole(user, "seller")) return NextResponse.json({ error: "forbidden", message: "This needs the seller role." }, { status: 403 });
    const query = sellerOrdersQuerySchema.parse(Object.fromEntries(url.searchParams));
    return NextResponse.json(await listSellerOrders(user.id, query));
  }
  return NextResponse.json(await listBuyerOrders(user.id, { page }));
});
