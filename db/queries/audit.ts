import "server-only";
import { and, count, desc, eq, gte, like, lt, sql } from "drizzle-orm";
import { job } from "@/db/schema";
import { db } from "@/lib/db";

type AuditQuery = { q?: string; from?: string; to?: string; page: number; pageSize: number };

// Released jobs only: the finished records an auditor checks. Search matches number, VIN, axle tag, customer.
export async function searchReleased(shopId: string, q: AuditQuery) {
  const filters = [eq(job.shopId, shopId), eq(job.status, "released")];
  if (q.q) filters.push(like(job.searchText, `%${q.q.toLowerCase().replace(/[%_\\]/g, (c) => `\\${c}`)}%`));
  if (q.from) filters.push(gte(job.releasedAt, new Date(`${q.from}T00:00:00Z`)));
  if (q.to) filters.push(lt(job.releasedAt, new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000)));
  const where = and(...filters);
  const [rows, [total]] = await Promise.all([
    db()
      .select({
        id: job.id,
        number: job.number,
        customerName: job.customerName,
        vin: job.vin,
        axleTag: job.axleTag,
        vehicle: sql<string>`trim(coalesce(${job.vehicleYear}::text, '') || ' ' || ${job.vehicleMakeModel})`,
        procedure: sql<string>`${job.procedureTitle} || ' v' || ${job.procedureVersionNumber}`,
        releasedAt: job.releasedAt,
      })
      .from(job)
      .where(where)
      .orderBy(desc(job.releasedAt))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db().select({ n: count() }).from(job).where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

/** Released jobs matching the same filters as `searchReleased`, newest first, a page at a time after `after`
 * (keyset paging, so jobs released while an export runs neither repeat nor shift the pages). */
export async function releasedJobPage(shopId: string, q: Omit<AuditQuery, "page" | "pageSize">, after: { releasedAt: Date; id: string } | null, limit: number) {
  const filters = [eq(job.shopId, shopId), eq(job.status, "released")];
  if (q.q) filters.push(like(job.searchText, `%${q.q.toLowerCase().replace(/[%_\\]/g, (c) => `\\${c}`)}%`));
  if (q.from) filters.push(gte(job.releasedAt, new Date(`${q.from}T00:00:00Z`)));
  if (q.to) filters.push(lt(job.releasedAt, new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000)));
  if (after) filters.push(sql`(${job.releasedAt}, ${job.id}) < (${after.releasedAt.toISOString()}::timestamptz, ${after.id}::uuid)`);
  const rows = await db()
    .select({ id: job.id, releasedAt: job.releasedAt })
    .from(job)
    .where(and(...filters))
    .orderBy(desc(job.releasedAt), desc(job.id))
    .limit(limit);
  return rows.filter((r): r is { id: string; releasedAt: Date } => r.releasedAt !== null);
}
