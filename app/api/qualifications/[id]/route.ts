import { getQualification, updateQualification } from "@/db/queries/qualifications";
import { shopRoute } from "@/lib/api/route";
import { qualificationIdParam } from "../params";
import { qualificationPatchSchema } from "@/lib/welding/qualification-schema";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => ({
  qualification: await getQualification(ctx.shopId, qualificationIdParam(params)),
}));

export const PATCH = shopRoute({ action: "qualification:write", body: qualificationPatchSchema }, async ({ ctx, params, body }) => {
  const id = qualificationIdParam(params);
  await updateQualification({ shopId: ctx.shopId, actorId: ctx.userId, id, patch: body });
  return { qualification: await getQualification(ctx.shopId, id) };
});
