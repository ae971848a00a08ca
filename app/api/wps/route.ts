import { NextResponse } from "next/server";
import { createWps, getRevision, listWps } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { wpsCreateSchema, wpsListQuerySchema } from "@/lib/welding/wps-schema";

export const dynamic = "force-dynamic";

// Everyone in the shop reads the library (welders weld to it, auditors check it); leads write it.
export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, query }) => {
  const q = wpsListQuerySchema.parse(Object.fromEntries(query));
  const { rows, total } = await listWps(ctx.shopId, q);
  return { wps: rows, total, page: q.page, pageSize: q.pageSize };
});

export const POST = shopRoute({ action: "wps:write", body: wpsCreateSchema }, async ({ ctx, body }) => {
  const created = await createWps({ shopId: ctx.shopId, actorId: ctx.userId, ...body });
  const revision = await getRevision(ctx.shopId, created.id, 1);
  return NextResponse.json({ wps: { id: created.id, reference: created.reference }, revision }, { status: 201 });
});
