import { getRevision, publishRevision } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { revisionParam, wpsIdParam } from "../../../../params";
import { publishSchema } from "@/lib/welding/wps-schema";

export const dynamic = "force-dynamic";

// Draft → published with a change note; the revision in use before is retired as superseded.
// 422 names the fields a publishable WPS still lacks; 409 when the revision is not a draft.
export const POST = shopRoute({ action: "wps:write", body: publishSchema }, async ({ ctx, params, body }) => {
  const id = wpsIdParam(params);
  const number = revisionParam(params);
  const { superseded } = await publishRevision({ shopId: ctx.shopId, wpsId: id, number, changeNote: body.changeNote, actorId: ctx.userId });
  return { revision: await getRevision(ctx.shopId, id, number), superseded };
});
