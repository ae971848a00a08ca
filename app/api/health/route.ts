import { NextResponse } from "next/server";
import { databaseIsUp } from "@/db/queries/health";

export const dynamic = "force-dynamic";

export async function GET() {
  const up = await databaseIsUp();
  return NextResponse.json({ ok: up, db: up ? "up" : "down" }, { status: up ? 200 : 503, headers: { "Cache-Control": "no-store" } });
}
