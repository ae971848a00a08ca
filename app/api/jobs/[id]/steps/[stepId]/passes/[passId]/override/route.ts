import { NextResponse } from "next/server";
import { overrideWeldPass } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { overridePassSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/passes/{passId}/override { reason, pin } → 201 { record }.
// A lead accepts an out-of-range pass as welded; a pass within its WPS, or one already decided: 409.
export const POST = shopRoute({ action: "weld:override", body: overridePassSchema }, async ({ ctx, params, body }) => {
  const record = await overrideWeldPass(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), idParam(params, "passId", "Pass"), body);
  return NextResponse.json({ record }, { status: 201 });
});
