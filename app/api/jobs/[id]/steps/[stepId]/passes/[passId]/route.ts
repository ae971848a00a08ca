import { strikeWeldPass } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { idParam } from "../../../../../_lib/params";

export const dynamic = "force-dynamic";

// DELETE /api/jobs/{id}/steps/{stepId}/passes/{passId} → JobRecord. Strikes the pass out (kept, marked removed);
// only its welder, only before the step is signed.
export const DELETE = shopRoute({ action: "weld:log" }, async ({ ctx, params }) =>
  strikeWeldPass(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), idParam(params, "passId", "Weld pass")),
);
