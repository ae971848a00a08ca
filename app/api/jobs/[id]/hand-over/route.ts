import { handOverInspectors } from "@/db/queries/jobs-handover";
import { shopRoute } from "@/lib/api/route";
import { authorizeChecklistWork, idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// GET /api/jobs/{id}/hand-over → { inspectors: [{ membershipId, name }] }: who the tablet can be handed to for
// one sign-off (active inspectors with a PIN, not the person holding it).
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  idParam(params, "id", "Job");
  authorizeChecklistWork(ctx);
  return { inspectors: await handOverInspectors(ctx) };
});
