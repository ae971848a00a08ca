import { searchReleased } from "@/db/queries/audit";
import { shopRoute } from "@/lib/api/route";
import { auditQuerySchema } from "@/lib/schemas/audit";

export const dynamic = "force-dynamic";

// Released jobs of the shop, for auditors: GET /api/records?q=&from=&to=&page=
export const GET = shopRoute({ action: "audit:search" }, async ({ ctx, query }) => {
  const q = auditQuerySchema.parse(Object.fromEntries(query));
  const { rows, total } = await searchReleased(ctx.shopId, q);
  return { records: rows, total, page: q.page, pageSize: q.pageSize };
});
