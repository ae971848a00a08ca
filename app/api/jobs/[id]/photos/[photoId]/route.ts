import { removePhoto } from "@/db/queries/jobs-photos";
import { shopRoute } from "@/lib/api/route";
import { authorizeChecklistWork, idParam } from "../../../_lib/params";

export const dynamic = "force-dynamic";

// DELETE /api/jobs/{id}/photos/{photoId} → JobRecord. Takes a photo off an unsigned step; the file and row stay.
export const DELETE = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  authorizeChecklistWork(ctx);
  return removePhoto(ctx, idParam(params, "id", "Job"), idParam(params, "photoId", "Photo"));
});
