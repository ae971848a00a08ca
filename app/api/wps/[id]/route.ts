import { getRevision, getWps } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { wpsIdParam } from "../params";

export const dynamic = "force-dynamic";

// The WPS with its revision history (newest first) and the revision a reader sees: the published one, else the newest.
export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params }) => {
  const id = wpsIdParam(params);
  const w = await getWps(ctx.shopId, id);
  const current = await getRevision(ctx.shopId, id, w.shownNumber);
  const { revisions, shownNumber: _shown, ...head } = w;
  return { wps: head, revisions, current };
});
