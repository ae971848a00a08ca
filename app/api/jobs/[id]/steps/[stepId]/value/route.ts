import { saveStepValue } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { saveValueSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// PUT /api/jobs/{id}/steps/{stepId}/value { baseVersion, value } → JobRecord.
// 409 when the step changed since baseVersion (error.current: { value, version, updatedBy, updatedAt }) or is signed.
export const PUT = shopRoute({ action: "job:read", body: saveValueSchema }, async ({ ctx, params, body }) => {
  authorizeChecklistWork(ctx);
  return saveStepValue(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
});
