import { getRevision, retireRevision } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { revisionParam, wpsIdParam } from "../../../../params";
import { retireSchema } from "@/lib/welding/wps-schema";

export const dynamic = "force-dynamic";

// Published → retired with a reason: the WPS goes out of use; its text stays readable for the record.
export const POST = shopRoute({ action: "wps:write", body: retireSchema }, async ({ ctx, params, body }) => {
  const id = wpsIdParam(params);
  const number = revisionParam(params);
  await retireRevision({ shopId: ctx.shopId, wpsId: id, number, reason: body.reason, actorId: ctx.userId });
  return { revision: await getRevision(ctx.shopId, id, number) };
});
