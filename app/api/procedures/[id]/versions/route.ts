import { NextResponse } from "next/server";
import { startNewVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { procedureIdFrom } from "../../_lib/params";

export const dynamic = "force-dynamic";

// Starts the next version as a draft copy of the latest one.
export const POST = shopRoute({ action: "procedure:write" }, async ({ ctx, params }) => {
  const v = await startNewVersion({ shopId: ctx.shopId, procedureId: procedureIdFrom(params), actorId: ctx.userId });
  return NextResponse.json({ version: { number: v.number, status: "draft", copiedFrom: v.from } }, { status: 201 });
});
