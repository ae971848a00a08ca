import { voidJob } from "@/db/queries/jobs";
import { shopRoute } from "@/lib/api/route";
import { voidSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/void { reason } → JobRecord (status void).
export const POST = shopRoute({ action: "job:write", body: voidSchema }, async ({ ctx, params, body }) => voidJob(ctx, idParam(params, "id", "Job"), body.reason));
