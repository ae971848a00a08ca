import { releaseJob } from "@/db/queries/jobs";
import { mailTravellerToCustomer } from "@/db/queries/traveller";
import { shopRoute } from "@/lib/api/route";
import { releaseSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/release { pin } → JobRecord (status released, releaseSignOff set); 409 with `blockers`.
// Then the customer is mailed the traveller (through the outbox: a mail failure never undoes the release).
export const POST = shopRoute({ action: "job:release", body: releaseSchema }, async ({ ctx, params, body }) => {
  const jobId = idParam(params, "id", "Job");
  const record = await releaseJob(ctx, jobId, body.pin);
  const mailed = await mailTravellerToCustomer(ctx, jobId);
  return { ...record, travellerMailed: mailed?.sent ?? false };
});
