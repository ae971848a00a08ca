import { timingSafeEqual } from "node:crypto";
import { NextResponse } from "next/server";
import { errorResponse } from "@/lib/api/route";
import { env } from "@/lib/env";
import { runQualificationNotices } from "./run";

export const dynamic = "force-dynamic";

// The daily lapsing-notice job, for a scheduler that holds the server's secret; anyone else gets a 404.
export async function POST(req: Request) {
  const given = Buffer.from(req.headers.get("x-gusset-secret") ?? "");
  const secret = Buffer.from(env().BETTER_AUTH_SECRET);
  if (given.length !== secret.length || !timingSafeEqual(given, secret)) {
    return NextResponse.json({ error: { code: "not_found", message: "Not found." } }, { status: 404 });
  }
  try {
    return NextResponse.json(await runQualificationNotices());
  } catch (error) {
    return errorResponse(error);
  }
}
