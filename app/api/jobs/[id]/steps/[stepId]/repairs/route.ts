import { NextResponse } from "next/server";
import { recordRepair } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { repairSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/repairs { method, methodNote, depthMm, lengthMm, photoId } → 201 { record }.
// Only in a repair round before its first pass: 409 otherwise; photo not on the job: 422.
export const POST = shopRoute({ action: "job:read", body: repairSchema }, async ({ ctx, params, body }) => {
  authorizeChecklistWork(ctx);
  const result = await recordRepair(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json(result, { status: 201 });
});
