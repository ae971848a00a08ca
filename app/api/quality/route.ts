import { qualityFigures } from "@/db/queries/quality";
import { shopRoute } from "@/lib/api/route";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { defaultRange, qualityQuerySchema } from "@/lib/quality/schema";

export const dynamic = "force-dynamic";

// GET /api/quality?from=&to=&welderId=&wpsId=&procedureId= → the shop's quality figures, counted in SQL.
// Without dates: the last 90 days. A welder (without a shop-wide role) gets the figures of their own work only.
export const GET = shopRoute({ action: "quality:read" }, async ({ ctx, query }) => {
  const q = qualityQuerySchema.parse(Object.fromEntries(query));
  const shopWide = can(ctx.roles, "quality:shop");
  if (!shopWide && q.welderId && q.welderId !== ctx.userId) {
    throw new AppError("forbidden", "A welder sees the figures of their own work only.", { welderId: ["Only your own figures."] });
  }
  const range = q.from || q.to ? { from: q.from, to: q.to } : defaultRange(new Date().toISOString().slice(0, 10));
  const figures = await qualityFigures({ shopId: ctx.shopId, ...range, welderId: shopWide ? q.welderId : ctx.userId, wpsId: q.wpsId, procedureId: q.procedureId });
  return { ...figures, scope: shopWide && !q.welderId ? "shop" : "welder" };
});
