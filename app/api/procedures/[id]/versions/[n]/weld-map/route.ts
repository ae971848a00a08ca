import { z } from "zod";
import { setDraftWeldMap } from "@/db/queries/procedure-images";
import { getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { mapJointSchema } from "@/lib/weld-map";
import { procedureIdFrom, versionNumberFrom } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

const body = z
  .object({
    imageIds: z.array(z.uuid("An image id is a UUID.")).max(8, "At most 8 images on a weld map."),
    joints: z.array(mapJointSchema).max(500),
  })
  .strict();

// PUT /api/procedures/{id}/versions/{n}/weld-map { imageIds, joints } → { version }: the draft's markers.
export const PUT = shopRoute({ action: "procedure:write", body }, async ({ ctx, params, body }) => {
  const ref = { shopId: ctx.shopId, procedureId: procedureIdFrom(params), number: versionNumberFrom(params) };
  await setDraftWeldMap(ref, body);
  return { version: await getVersion(ref.shopId, ref.procedureId, ref.number) };
});
