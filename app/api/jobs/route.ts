import { NextResponse } from "next/server";
import { createJob, listJobs } from "@/db/queries/jobs";
import { shopRoute } from "@/lib/api/route";
import { createJobSchema, listJobsQuerySchema } from "@/lib/jobs/schemas";

export const dynamic = "force-dynamic";

// GET /api/jobs?q=&status=&assignee=&dueFrom=&dueTo=&sort=&dir=&page=&pageSize=
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, query }) => {
  const q = listJobsQuerySchema.parse(Object.fromEntries(query));
  const { rows, total } = await listJobs(ctx.shopId, q, ctx.userId);
  return { jobs: rows, total, page: q.page, pageSize: q.pageSize };
});

// POST /api/jobs → 201 { job: { id, number }, vin: { warning, checkDigitOk } }
export const POST = shopRoute({ action: "job:write", body: createJobSchema }, async ({ ctx, body }) => {
  const created = await createJob(ctx, body);
  return NextResponse.json(
    { job: { id: created.id, number: created.number }, vin: { warning: created.vinWarning, checkDigitOk: created.checkDigitOk } },
    { status: 201 },
  );
});
