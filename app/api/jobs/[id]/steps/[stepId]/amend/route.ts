import { NextResponse } from "next/server";
import { amendStep } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { amendStepSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/amend { pin, amendsSignOffId, reason, value } → 201 { signOffId, record }.
// The original stays; the amendment points at the sign-off it corrects (the latest of the step).
export const POST = shopRoute({ action: "job:read", body: amendStepSchema }, async ({ ctx, params, body }) => {
  authorizeChecklistWork(ctx);
  const result = await amendStep(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json(result, { status: 201 });
});
