import { getRevision, saveDraft } from "@/db/queries/wps";
import { shopRoute } from "@/lib/api/route";
import { revisionParam, wpsIdParam } from "../../../params";
import { toWpsRanges, wpsPatchSchema } from "@/lib/welding/wps-schema";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params }) => {
  const revision = await getRevision(ctx.shopId, wpsIdParam(params), revisionParam(params));
  return { revision, ranges: toWpsRanges(revision.content) };
});

// Only a draft changes; a published or retired revision answers 409 (and the database refuses it too).
export const PATCH = shopRoute({ action: "wps:write", body: wpsPatchSchema }, async ({ ctx, params, body }) => {
  const id = wpsIdParam(params);
  const number = revisionParam(params);
  await saveDraft({ shopId: ctx.shopId, wpsId: id, number, actorId: ctx.userId, patch: body });
  return { revision: await getRevision(ctx.shopId, id, number) };
});
