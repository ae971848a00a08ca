import { NextResponse } from "next/server";
import { createProcedure, listProcedures } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { createProcedureBody, listQuerySchema } from "@/lib/procedures/forms";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, query }) => {
  const q = listQuerySchema.parse(Object.fromEntries(query));
  const { rows, total } = await listProcedures(ctx.shopId, q);
  return { procedures: rows, total, page: q.page, pageSize: q.pageSize };
});

export const POST = shopRoute({ action: "procedure:write", body: createProcedureBody }, async ({ ctx, body }) => {
  const created = await createProcedure({ shopId: ctx.shopId, actorId: ctx.userId, title: body.title, scope: body.scope, code: body.code, content: body.content });
  return NextResponse.json({ procedure: { id: created.id, title: body.title }, version: { number: created.number, status: "draft" } }, { status: 201 });
});
