import { NextResponse } from "next/server";
import { inspectJoint } from "@/db/queries/jobs-welds";
import { shopRoute } from "@/lib/api/route";
import { inspectionSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/inspections { criteria, observations, decision, notes, photoIds, pin }
// → 201 { inspectionId, verdict, record }. Not waiting for inspection: 409; the inspector welded a pass of
// the joint: 403; accepting what the criteria reject: 422 with the failed items and their limits.
export const POST = shopRoute({ action: "inspection:sign", body: inspectionSchema }, async ({ ctx, params, body }) => {
  const result = await inspectJoint(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json(result, { status: 201 });
});
