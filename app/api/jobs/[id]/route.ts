import { getJobRecord } from "@/db/queries/jobs-core";
import { updateJob } from "@/db/queries/jobs";
import { shopRoute } from "@/lib/api/route";
import { updateJobSchema } from "@/lib/jobs/schemas";
import { idParam } from "../_lib/params";

export const dynamic = "force-dynamic";

// GET /api/jobs/{id} → the whole record (JobRecord): header, steps with sign-offs, photos, passes, NCs.
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => getJobRecord(ctx, idParam(params, "id", "Job")));

// PATCH /api/jobs/{id} { baseVersion, ...header fields } → JobRecord; a stale baseVersion answers 409 with `current`.
export const PATCH = shopRoute({ action: "job:write", body: updateJobSchema }, async ({ ctx, params, body }) => updateJob(ctx, idParam(params, "id", "Job"), body));
