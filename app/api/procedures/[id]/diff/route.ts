import { z } from "zod";
import { getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { diffVersions } from "@/lib/procedures/diff";
import { procedureIdFrom } from "../../_lib/params";

export const dynamic = "force-dynamic";

const query = z.object({ from: z.coerce.number().int().min(1), to: z.coerce.number().int().min(1) });

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params, query: search }) => {
  const procedureId = procedureIdFrom(params);
  const q = query.parse(Object.fromEntries(search));
  const [from, to] = await Promise.all([getVersion(ctx.shopId, procedureId, q.from), getVersion(ctx.shopId, procedureId, q.to)]);
  return { diff: diffVersions(from, to) };
});
