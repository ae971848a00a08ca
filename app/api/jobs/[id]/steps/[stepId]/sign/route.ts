import { NextResponse } from "next/server";
import { signStep } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { signStepSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/sign { pin, baseVersion } → 201 { signOffId, record }.
// 403 wrong PIN (tries left) or separation of duties, 409 signed/stale, 422 not signable (reasons), 423 locked.
export const POST = shopRoute({ action: "job:read", body: signStepSchema }, async ({ ctx, params, body }) => {
  authorizeChecklistWork(ctx);
  const result = await signStep(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json(result, { status: 201 });
});
