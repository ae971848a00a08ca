import { retireVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { procedureIdFrom, versionNumberFrom } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// Retired versions stay readable (jobs pinned to them keep them) but new jobs cannot pick them.
export const POST = shopRoute({ action: "procedure:write" }, async ({ ctx, params }) => {
  const r = await retireVersion({ shopId: ctx.shopId, procedureId: procedureIdFrom(params), number: versionNumberFrom(params), actorId: ctx.userId });
  return { version: { number: r.number, status: "retired", retiredAt: r.retiredAt } };
});
