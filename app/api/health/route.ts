import { NextResponse } from "next/server";
import { databaseIsUp } from "@/db/queries/health";

export const dynamic = "force-dynamic";

export async function GET() {
  const up = await databaseIsUp();
  return NextResponse.json(up ? { ok: true, db: "up" } : { ok: false, db: "down" }, {
    status: up ? 200 : 503,
    headers: { "cache-control": "no-store" },
  });
}
