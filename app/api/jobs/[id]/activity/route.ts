import { z } from "zod";
import { jobActivityPage } from "@/db/queries/jobs";
import { shopRoute } from "@/lib/api/route";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

const query = z.object({ page: z.coerce.number().int().min(1).max(100_000).catch(1), pageSize: z.coerce.number().int().min(1).max(200).catch(50) });

// GET /api/jobs/{id}/activity?page= → { activity: [...], total, page, pageSize }, newest first.
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params, query: q }) => {
  const { page, pageSize } = query.parse(Object.fromEntries(q));
  const { rows, total } = await jobActivityPage(ctx.shopId, idParam(params, "id", "Job"), page, pageSize);
  return { activity: rows, total, page, pageSize };
});
