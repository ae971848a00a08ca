import { NextResponse } from "next/server";
import { inspectJoint } from "@/db/queries/jobs-welds";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { inspectionSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/inspections { criteria, observations, decision, notes, photoIds, pin }
// → 201 { inspectionId, verdict, record }. Not waiting for inspection: 409; the inspector welded a pass of
// the joint: 403; accepting what the criteria reject: 422 with the failed items and their limits.
// { handOver: { membershipId } }: an inspector inspects on the holder's tablet with their own PIN, so the
// session may be a welder's; the signer's inspector role is checked in inspectJoint.
export const POST = shopRoute({ action: "job:read", body: inspectionSchema }, async ({ ctx, params, body }) => {
  if (!body.handOver && !ctx.roles.includes("inspector")) throw new AppError("forbidden", "Only an inspector inspects welds.");
  authorizeChecklistWork(ctx);
  const result = await inspectJoint(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json(result, { status: 201 });
});
