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
