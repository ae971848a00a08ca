import { releaseJob } from "@/db/queries/jobs";
import { shopRoute } from "@/lib/api/route";
import { releaseSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/release { pin } → JobRecord (status released, releaseSignOff set); 409 with `blockers`.
export const POST = shopRoute({ action: "job:release", body: releaseSchema }, async ({ ctx, params, body }) => releaseJob(ctx, idParam(params, "id", "Job"), body.pin));
