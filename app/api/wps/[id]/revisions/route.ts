import { NextResponse } from "next/server";
import { getRevision, startRevision } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { wpsIdParam } from "../../params";

export const dynamic = "force-dynamic";

// A new revision starts as a draft copy of the newest one; 409 while a draft is open.
export const POST = shopRoute({ action: "wps:write" }, async ({ ctx, params }) => {
  const id = wpsIdParam(params);
  const { number } = await startRevision({ shopId: ctx.shopId, wpsId: id, actorId: ctx.userId });
  return NextResponse.json({ revision: await getRevision(ctx.shopId, id, number) }, { status: 201 });
});
