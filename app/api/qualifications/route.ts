import { NextResponse } from "next/server";
import { createQualification, getQualification, listQualifications } from "@/db/queries/qualifications";
import { shopRoute } from "@/lib/api/route";
import { qualificationCreateSchema, qualificationListQuerySchema } from "@/lib/welding/qualification-schema";

export const dynamic = "force-dynamic";

// Every member reads who is qualified for what (welders see their own standing; auditors check it); leads write.
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, query }) => {
  const q = qualificationListQuerySchema.parse(Object.fromEntries(query));
  const { rows, total, code, today } = await listQualifications(ctx.shopId, {
    q: q.q,
    process: q.process,
    status: q.status,
    welderUserId: q.welder,
    page: q.page,
    pageSize: q.pageSize,
  });
  return { qualifications: rows, total, page: q.page, pageSize: q.pageSize, continuityCode: code, today };
});

export const POST = shopRoute({ action: "qualification:write", body: qualificationCreateSchema }, async ({ ctx, body }) => {
  const { id } = await createQualification({ shopId: ctx.shopId, actorId: ctx.userId, input: body });
  return NextResponse.json({ qualification: await getQualification(ctx.shopId, id) }, { status: 201 });
});
