import { timingSafeEqual } from "node:crypto";
import { NextResponse } from "next/server";
import { errorResponse } from "@/lib/api/route";
import { env } from "@/lib/env";
import { flushOutbox } from "@/lib/mail";

export const dynamic = "force-dynamic";

// Retries unsent mail; called by the start script every minute with the server's own secret.
export async function POST(req: Request) {
  const given = Buffer.from(req.headers.get("x-gusset-secret") ?? "");
  const secret = Buffer.from(env().BETTER_AUTH_SECRET);
  if (given.length !== secret.length || !timingSafeEqual(given, secret)) {
    return NextResponse.json({ error: { code: "not_found", message: "Not found." } }, { status: 404 });
  }
  try {
    return NextResponse.json(await flushOutbox());
  } catch (error) {
    return errorResponse(error);
  }
}
