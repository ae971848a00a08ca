import { z } from "zod";
import { getProcedure } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { procedureIdFrom } from "../_lib/params";

export const dynamic = "force-dynamic";

const pagingSchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
});

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params, query }) => {
  const paging = pagingSchema.parse(Object.fromEntries(query));
  const p = await getProcedure(ctx.shopId, procedureIdFrom(params), paging);
  return {
    procedure: {
      id: p.id,
      title: p.title,
      scope: p.scope,
      code: p.code,
      owner: { id: p.ownerId, name: p.ownerName },
      createdAt: p.createdAt,
      versions: p.versions,
    },
    versionTotal: p.versionTotal,
    page: paging.page,
    pageSize: paging.pageSize,
  };
});
