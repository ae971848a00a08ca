import { changeDraft, discardDraft, getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { patchVersionBody } from "@/lib/procedures/forms";
import { procedureIdFrom, versionNumberFrom } from "../../../_lib/params";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params }) => ({
  version: await getVersion(ctx.shopId, procedureIdFrom(params), versionNumberFrom(params)),
}));

// Only a draft changes. A published or retired one answers 409 (and the database refuses it too).
export const PATCH = shopRoute({ action: "procedure:write", body: patchVersionBody }, async ({ ctx, params, body }) => {
  const ref = { shopId: ctx.shopId, procedureId: procedureIdFrom(params), number: versionNumberFrom(params) };
  await changeDraft(ref, () => body);
  return { version: await getVersion(ref.shopId, ref.procedureId, ref.number) };
});

export const DELETE = shopRoute({ action: "procedure:write" }, async ({ ctx, params }) => {
  const procedureId = procedureIdFrom(params);
  const number = versionNumberFrom(params);
  const r = await discardDraft({ shopId: ctx.shopId, procedureId, number, actorId: ctx.userId });
  return { discarded: { number }, procedureDeleted: r.procedureDeleted };
});
