import { z } from "zod";
import { getJobRecord } from "@/db/queries/jobs-core";
import { rebaseWeldMap } from "@/db/queries/jobs-photos";
import { shopRoute } from "@/lib/api/route";
import { mapPointSchema, WELD_MAP_MAX_PATH_POINTS } from "@/lib/weld-map";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

const body = z
  .object({
    photoId: z.uuid("Choose a photo of this job."),
    joints: z
      .array(
        mapPointSchema
          .extend({
            jointId: z.string().regex(/^W\d{1,3}$/, "A joint id is W followed by a number (W1, W2…)."),
            path: z.array(mapPointSchema).min(2).max(WELD_MAP_MAX_PATH_POINTS).optional(),
          })
          .strict(),
      )
      .min(1, "Place the weld joints on the photo.")
      .max(500),
  })
  .strict();

// GET /api/jobs/{id}/weld-map → { weldMap }
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => ({ weldMap: (await getJobRecord(ctx, idParam(params, "id", "Job"))).weldMap }));

// PUT /api/jobs/{id}/weld-map { photoId, joints: [{ jointId, x, y, path? }] } → { record }: the map re-based on
// a photo of this axle, every weld joint placed on it. 409 once the job is released or void.
export const PUT = shopRoute({ action: "weldmap:rebase", body }, async ({ ctx, params, body }) => ({
  record: await rebaseWeldMap(ctx, idParam(params, "id", "Job"), body),
}));
