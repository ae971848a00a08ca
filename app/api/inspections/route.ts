import { z } from "zod";
import { jointsAwaitingInspection } from "@/db/queries/jobs-welds";
import { shopRoute } from "@/lib/api/route";

export const dynamic = "force-dynamic";

const querySchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).catch(1),
  pageSize: z.coerce.number().int().min(1).max(100).catch(25),
});

// GET /api/inspections?page=&pageSize= → { joints, total, page, pageSize }: weld joints whose round is signed
// by its welder and waits for visual inspection, oldest first. `ownWeld` marks those the asker may not inspect.
export const GET = shopRoute({ action: "inspection:sign" }, async ({ ctx, query }) => {
  const q = querySchema.parse(Object.fromEntries(query));
  const { rows, total } = await jointsAwaitingInspection(ctx.shopId, ctx.userId, { limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
  return { joints: rows, total, page: q.page, pageSize: q.pageSize };
});
