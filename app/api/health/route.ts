import { NextResponse } from "next/server";
import { databaseIsUp } from "@/db/queries/health";
import { DATABASE_RETRY_AFTER_SECONDS } from "@/lib/errors";

export const dynamic = "force-dynamic";

export async function GET() {
  const up = await databaseIsUp();
  return NextResponse.json({ ok: up, db: up ? "up" : "down" }, {
    status: up ? 200 : 503,
    headers: { "Cache-Control": "no-store", ...(up ? {} : { "Retry-After": String(DATABASE_RETRY_AFTER_SECONDS) }) },
  });
}
