import { NextResponse } from "next/server";
import { raiseNonconformance } from "@/db/queries/jobs-nc";
import { getJobRecord } from "@/db/queries/jobs-core";
import { shopRoute } from "@/lib/api/route";
import { raiseNcSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// GET /api/jobs/{id}/nonconformances → { nonconformances }
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  const record = await getJobRecord(ctx, idParam(params, "id", "Job"));
  return { nonconformances: record.nonconformances };
});

// POST /api/jobs/{id}/nonconformances { stepId, description, proposedDisposition, photoIds } → 201 { nonconformanceId, number, record }
export const POST = shopRoute({ action: "nonconformance:raise", body: raiseNcSchema }, async ({ ctx, params, body }) => {
  const result = await raiseNonconformance(ctx, idParam(params, "id", "Job"), body);
  return NextResponse.json(result, { status: 201 });
});
