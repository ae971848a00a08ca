import { listMembers } from "@/db/queries/people";
import { shopRoute } from "@/lib/api/route";
import { peopleQuerySchema } from "@/lib/schemas/people";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "people:read" }, async ({ ctx, query }) => {
  const q = peopleQuerySchema.parse(Object.fromEntries(query));
  const { rows, total } = await listMembers(ctx.shopId, { q: q.q, page: q.page, pageSize: q.pageSize, includeInactive: q.inactive === "1" });
  return { people: rows, total, page: q.page, pageSize: q.pageSize };
});
